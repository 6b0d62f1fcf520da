// Pure alert diffing: given the crossings of the profiles in force and the alerts already stored, decide what to
// insert, update, clear or carry over. No database here; server/domain/alerts/evaluate.ts applies the plan.
import type { LimitCheck } from '../../../shared/limits'

export type StoredAlertState = 'active' | 'cleared' | 'superseded' | 'expired'
export interface StoredAlert {
  id: number
  profileId: number
  designator: string
  kind: string
  state: StoredAlertState
  value: number
  limitValue: number
}
export interface ProfileFacts {
  id: number
  status: 'active' | 'superseded' | 'withdrawn'
  supersededById: number | null
  validTo: Date
}
export interface Candidate { profileId: number, checks: LimitCheck[] }

export type PlanStep
  = | { action: 'insert', profileId: number, check: LimitCheck, continuesAlertId: number | null, notify: boolean }
    | { action: 'update', alertId: number, check: LimitCheck }
    | { action: 'reactivate', alertId: number, check: LimitCheck }
    | { action: 'carry-over', alertId: number, toProfileId: number }
    | { action: 'expire', alertId: number }
    | { action: 'clear', alertId: number, reason: string }

export const alertKey = (profileId: number, designator: string | null, kind: string) => `${profileId}|${designator ?? ''}|${kind}`

export function planAlerts(input: { now: Date, candidates: Candidate[], existing: StoredAlert[], profiles: Map<number, ProfileFacts> }): PlanStep[] {
  const steps: PlanStep[] = []
  const desired = new Map<string, { profileId: number, check: LimitCheck, continuesAlertId: number | null }>()
  const allChecks = new Map<string, LimitCheck>()
  for (const c of input.candidates) {
    for (const check of c.checks) {
      const key = alertKey(c.profileId, check.designator, check.kind)
      allChecks.set(key, check)
      if (check.state === 'exceeded') desired.set(key, { profileId: c.profileId, check, continuesAlertId: null })
    }
  }
  const existingByKey = new Map(input.existing.map(a => [alertKey(a.profileId, a.designator, a.kind), a]))

  for (const a of input.existing) {
    const key = alertKey(a.profileId, a.designator, a.kind)
    if (a.state !== 'active' || desired.has(key)) continue
    const p = input.profiles.get(a.profileId)
    const nextKey = p?.supersededById ? alertKey(p.supersededById, a.designator, a.kind) : null
    const successor = nextKey ? desired.get(nextKey) : undefined
    if (p?.status === 'superseded' && successor && !existingByKey.has(nextKey!)) {
      // The same crossing carries over to the newer version: no new notice, the chain is kept.
      successor.continuesAlertId = a.id
      steps.push({ action: 'carry-over', alertId: a.id, toProfileId: p.supersededById! })
    }
    else if (p?.status === 'active' && p.validTo.getTime() <= input.now.getTime()) {
      steps.push({ action: 'expire', alertId: a.id })
    }
    else {
      steps.push({ action: 'clear', alertId: a.id, reason: clearReason(p, allChecks.get(key), nextKey ? allChecks.get(nextKey) : undefined) })
    }
  }

  for (const [key, d] of desired) {
    const e = existingByKey.get(key)
    if (!e) {
      steps.push({ action: 'insert', profileId: d.profileId, check: d.check, continuesAlertId: d.continuesAlertId, notify: d.continuesAlertId == null })
    }
    else if (e.state === 'active') {
      if (round1(e.value) !== round1(d.check.value) || e.limitValue !== d.check.limit) steps.push({ action: 'update', alertId: e.id, check: d.check })
    }
    else {
      steps.push({ action: 'reactivate', alertId: e.id, check: d.check })
    }
  }
  return steps
}

const round1 = (x: number) => Math.round(x * 10) / 10

function clearReason(p: ProfileFacts | undefined, sameProfile: LimitCheck | undefined, successor: LimitCheck | undefined): string {
  if (!p) return 'All clear: the profile is no longer on file'
  if (p.status === 'withdrawn') return 'All clear: the profile was withdrawn'
  if (p.status === 'superseded') {
    return `All clear: the newer profile #${p.supersededById} no longer crosses this limit${successor ? ` (${successor.message})` : ''}`
  }
  return `All clear: no longer crosses the limit in force${sameProfile ? ` (${sameProfile.message})` : ''}`
}

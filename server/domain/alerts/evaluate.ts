// Alert evaluation inside the transaction that changed profiles or limits: analyse the profiles in force at the
// airfield, plan the alert changes (plan.ts), apply them and queue the notices in the outbox, all in that transaction.
// Filing, withdrawing and limit changes call it directly, once per airfield and change; each run leaves one audit
// entry ('alerts.evaluate'), so a reader (and a test) can count the runs.
import { and, eq, gt, inArray, schema, sql, takeTurn } from '../../utils/db'
import type { Tx } from '../../utils/db'
import { recordAudit, type AuditActor } from '../../utils/audit'
import type { ProfileAnalysis } from '../../../shared/wind'
import { loadAndAnalyseProfiles } from '../profiles/analysis'
import { effectiveLimits } from './limits'
import { evaluateLimits, type LimitCheck } from '../../../shared/limits'
import { planAlerts, type ProfileFacts } from './plan'
import { enqueueAlertNotices } from './outbox'
import { inForceFrom, supersededAt, type ProfileSpan } from '../profiles/supersession'

/** Active profiles with the parts of their validity newer profiles took over. */
async function spansOf(tx: Tx, rows: { id: number, validFrom: Date, validTo: Date }[]): Promise<ProfileSpan[]> {
  const s = schema.profileSupersessions
  const records = rows.length ? await tx.select().from(s).where(inArray(s.profileId, rows.map(r => r.id))) : []
  return rows.map(r => ({ ...r, superseded: records.filter(x => x.profileId === r.id).map(x => ({ from: x.fromAt, to: x.toAt, byId: x.supersededById })) }))
}

export interface EvaluationSummary { airfieldId: number, raised: number[], cleared: number[], carried: number[], updated: number[] }

/** What caused an evaluation, for its audit entry. */
export type EvaluationTrigger = 'profile.file' | 'profile.withdraw' | 'limits.change' | 'seed'

export interface EvaluationOptions {
  trigger: EvaluationTrigger
  actor: AuditActor
  /** The base of the links in notices; defaults to the app's configured address. */
  appUrl?: string
  now?: Date
  /** Analyses already made by the caller (the profile just filed), so the engine does not run twice on them. */
  analyses?: ReadonlyMap<number, ProfileAnalysis>
  /** Why this run happens, when not a profile (a limit change and its reason): said on the alerts it raises or clears. */
  cause?: string
}

/** The app's public address, for links in notices. */
export function appUrlOf(): string {
  return process.env.NUXT_PUBLIC_APP_URL || useRuntimeConfig().public.appUrl
}

export async function evaluateAirfield(tx: Tx, airfieldId: number, options: EvaluationOptions): Promise<EvaluationSummary> {
  const now = options.now ?? new Date()
  const appUrl = options.appUrl ?? appUrlOf()
  // One evaluation per airfield at a time: two filings at once must not both insert or both clear (a turn row, so
  // that it holds across Galera nodes too).
  await takeTurn(tx, `airfield:${airfieldId}`)

  const p = schema.profiles
  const active = await tx.select({ id: p.id, validFrom: p.validFrom, validTo: p.validTo, reportedWindShear: p.reportedWindShear }).from(p)
    .where(and(eq(p.airfieldId, airfieldId), eq(p.status, 'active'), gt(p.validTo, now)))
  // Supersession by time: an active profile whose time from now on is all taken over by newer ones is not in force.
  const spans = await spansOf(tx, active)
  const inForce = spans.filter(s => inForceFrom(s, now))
  const known = options.analyses ?? new Map<number, ProfileAnalysis>()
  const loaded = await loadAndAnalyseProfiles(inForce.map(r => r.id).filter(id => !known.has(id)), tx)
  const analysisOf = new Map<number, ProfileAnalysis>([...known, ...loaded.map(a => [a.profile.id, a.analysis] as const)])
  const lim = await effectiveLimits(airfieldId, tx)
  const shearOf = new Map(active.map(r => [r.id, r.reportedWindShear ?? null]))
  const candidates = inForce.filter(r => analysisOf.has(r.id))
    .map(r => ({ profileId: r.id, checks: evaluateLimits(analysisOf.get(r.id)!, lim.limits, lim.limitsFor, shearOf.get(r.id) ?? null) }))

  const a = schema.alerts
  const existing = await tx.select().from(a).where(and(eq(a.airfieldId, airfieldId),
    sql`(${a.state} = 'active' OR ${inArray(a.profileId, [0, ...inForce.map(r => r.id)])})`))
  const profileIds = [...new Set(existing.map(e => e.profileId))]
  const facts = profileIds.length
    ? await tx.select({ id: p.id, status: p.status, supersededById: p.supersededById, validTo: p.validTo }).from(p).where(inArray(p.id, profileIds))
    : []
  // A profile still 'active' but no longer in force is, for its alerts, superseded by the profile in force now.
  const takenOver = new Map(spans.filter(s => !inForceFrom(s, now)).map(s => [s.id, s]))
  const factsNow = facts.map((f): ProfileFacts => {
    const span = takenOver.get(f.id)
    if (!span || f.status !== 'active') return f
    const by = supersededAt(span, now)?.byId ?? Math.max(...span.superseded.map(i => i.byId ?? 0))
    return { ...f, status: 'superseded', supersededById: by || null }
  })
  const plan = planAlerts({ now, candidates, existing, profiles: new Map<number, ProfileFacts>(factsNow.map(f => [f.id, f])) })

  const summary: EvaluationSummary = { airfieldId, raised: [], cleared: [], carried: [], updated: [] }
  const because = (text: string) => (options.cause ? `${text}, ${options.cause}` : text).slice(0, 300)
  const fields = (c: LimitCheck, raised = false) => ({ value: c.value, limitValue: c.limit, unit: c.unit, excess: c.excess,
    message: raised ? because(c.message) : c.message.slice(0, 300) })
  for (const step of plan) {
    switch (step.action) {
      case 'insert': {
        const [row] = await tx.insert(a).values({
          airfieldId, profileId: step.profileId, designator: step.check.designator ?? '', kind: step.check.kind,
          ...fields(step.check, step.notify && options.cause != null), continuesAlertId: step.continuesAlertId,
        }).$returningId()
        if (step.continuesAlertId != null) {
          // The inbox follows the chain: the same entries now point at the newer version's alert.
          await tx.update(schema.alertInbox).set({ alertId: row!.id }).where(eq(schema.alertInbox.alertId, step.continuesAlertId))
          summary.carried.push(row!.id)
        }
        if (step.notify) {
          await enqueueAlertNotices(tx, row!.id, 'raised', appUrl)
          summary.raised.push(row!.id)
        }
        break
      }
      case 'update':
        await tx.update(a).set({ ...fields(step.check), updatedAt: now }).where(eq(a.id, step.alertId))
        summary.updated.push(step.alertId)
        break
      case 'reactivate':
        await tx.update(a).set({ ...fields(step.check, options.cause != null), state: 'active', clearedAt: null, clearReason: null,
          raisedCount: sql`${a.raisedCount} + 1`, updatedAt: now }).where(eq(a.id, step.alertId))
        await enqueueAlertNotices(tx, step.alertId, 'raised', appUrl)
        summary.raised.push(step.alertId)
        break
      case 'carry-over':
        await tx.update(a).set({ state: 'superseded', clearedAt: now, clearReason: `Carried over to profile #${step.toProfileId}`, updatedAt: now })
          .where(eq(a.id, step.alertId))
        break
      case 'expire':
        await tx.update(a).set({ state: 'expired', clearedAt: now, clearReason: 'The profile\'s validity ended', updatedAt: now }).where(eq(a.id, step.alertId))
        break
      case 'clear':
        await tx.update(a).set({ state: 'cleared', clearedAt: now, clearReason: because(step.reason), updatedAt: now }).where(eq(a.id, step.alertId))
        await enqueueAlertNotices(tx, step.alertId, 'cleared', appUrl)
        summary.cleared.push(step.alertId)
        break
    }
  }
  await recordAudit(tx, options.actor, 'alerts.evaluate', 'airfield', airfieldId, {
    trigger: options.trigger, profilesInForce: inForce.length, analysedAgain: loaded.length,
    raised: summary.raised, cleared: summary.cleared, carried: summary.carried, updated: summary.updated,
  })
  return summary
}

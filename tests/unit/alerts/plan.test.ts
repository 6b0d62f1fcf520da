import { describe, expect, it } from 'vitest'
import { planAlerts, type ProfileFacts, type StoredAlert } from '../../../server/domain/alerts/plan'
import { layerLimits } from '../../../server/domain/alerts/limit-sets'
import { DEFAULT_LIMITS, type LimitCheck } from '../../../shared/limits'

const now = new Date('2026-05-01T06:00:00Z')
const later = new Date('2026-05-01T09:00:00Z')
const crosswind = (value: number, limit: number): LimitCheck => ({
  kind: 'crosswind', designator: '18', value, limit, unit: 'kt', excess: value - limit,
  state: value > limit ? 'exceeded' : 'within', message: `Crosswind runway 18 ${value.toFixed(1)} kt`,
})
const stored = (over: Partial<StoredAlert>): StoredAlert => ({ id: 1, profileId: 10, designator: '18', kind: 'crosswind', state: 'active', value: 19.28, limitValue: 18, ...over })
const facts = (...p: ProfileFacts[]) => new Map(p.map(x => [x.id, x]))
const active = (id: number): ProfileFacts => ({ id, status: 'active', supersededById: null, validTo: later })

describe('alert planning', () => {
  it('a new crossing is inserted once and notified; planning again with it stored does nothing', () => {
    const candidates = [{ profileId: 10, checks: [crosswind(19.28, 18)] }]
    const first = planAlerts({ now, candidates, existing: [], profiles: facts(active(10)) })
    expect(first).toEqual([{ action: 'insert', profileId: 10, check: candidates[0]!.checks[0], continuesAlertId: null, notify: true }])
    expect(planAlerts({ now, candidates, existing: [stored({})], profiles: facts(active(10)) })).toEqual([])
  })

  it('a newer version with the same crossing carries the alert over without a new notice', () => {
    const steps = planAlerts({
      now,
      candidates: [{ profileId: 11, checks: [crosswind(19.28, 18)] }],
      existing: [stored({})],
      profiles: facts({ id: 10, status: 'superseded', supersededById: 11, validTo: later }),
    })
    expect(steps).toContainEqual({ action: 'carry-over', alertId: 1, toProfileId: 11 })
    expect(steps).toContainEqual(expect.objectContaining({ action: 'insert', profileId: 11, continuesAlertId: 1, notify: false }))
  })

  it('a newer version that no longer crosses clears the alert and says why', () => {
    const steps = planAlerts({
      now,
      candidates: [{ profileId: 11, checks: [crosswind(12.86, 18)] }],
      existing: [stored({})],
      profiles: facts({ id: 10, status: 'superseded', supersededById: 11, validTo: later }),
    })
    expect(steps).toHaveLength(1)
    expect(steps[0]).toMatchObject({ action: 'clear', alertId: 1 })
    expect((steps[0] as { reason: string }).reason).toMatch(/^All clear: the newer profile #11 no longer crosses/)
  })

  it('a raised limit clears, a lowered one again reactivates the same row (never a second alert)', () => {
    const raised = planAlerts({ now, candidates: [{ profileId: 10, checks: [crosswind(19.28, 25)] }], existing: [stored({})], profiles: facts(active(10)) })
    expect(raised).toEqual([expect.objectContaining({ action: 'clear', alertId: 1 })])
    const lowered = planAlerts({ now, candidates: [{ profileId: 10, checks: [crosswind(19.28, 15)] }], existing: [stored({ state: 'cleared' })], profiles: facts(active(10)) })
    expect(lowered).toEqual([expect.objectContaining({ action: 'reactivate', alertId: 1 })])
  })

  it('withdrawn profiles clear; expired ones expire quietly', () => {
    expect(planAlerts({ now, candidates: [], existing: [stored({})], profiles: facts({ id: 10, status: 'withdrawn', supersededById: null, validTo: later }) }))
      .toEqual([{ action: 'clear', alertId: 1, reason: 'All clear: the profile was withdrawn' }])
    expect(planAlerts({ now, candidates: [], existing: [stored({})], profiles: facts({ id: 10, status: 'active', supersededById: null, validTo: now }) }))
      .toEqual([{ action: 'expire', alertId: 1 }])
  })
})

describe('limit layering', () => {
  it('runway end over airfield over organisation over the built-in defaults; null inherits', () => {
    const { limits, source } = layerLimits([
      { source: 'organisation', values: { maxCrosswindKt: 25, maxTailwindKt: null } },
      { source: 'airfield', values: { maxCrosswindKt: 18 } },
      { source: 'runway end', values: { maxCrosswindKt: null, maxAirspeedLossKt: 12 } },
    ])
    expect(limits).toEqual({ ...DEFAULT_LIMITS, maxCrosswindKt: 18, maxAirspeedLossKt: 12 })
    expect(source.maxCrosswindKt).toBe('airfield')
    expect(source.maxTailwindKt).toBe('built-in default')
    expect(source.maxAirspeedLossKt).toBe('runway end')
  })
})

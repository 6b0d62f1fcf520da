// Saving a limit set: upsert the set, keep the change (who, when, why, old and new values), audit it and
// re-evaluate the affected airfields, all in one transaction. A dry run does all of it and rolls it back, so the
// effect it answers is the one the real change makes.
import { and, eq, gt, inArray, schema, sql, transaction } from '../../utils/db'
import type { DB, Tx } from '../../utils/db'
import type { User } from '../../db/schema'
import { recordAudit } from '../../utils/audit'
import { evaluateAirfield, type EvaluationSummary } from './evaluate'
import { limitSetFromRows, scopeKeyOf, valuesOf } from './limits'
import { LIMIT_KEYS, type PartialLimits } from './limit-sets'
import type { LimitEffectItem } from '../../../shared/limits'

export type { LimitEffectItem }

/** Thrown inside a dry run's transaction so that everything it wrote is rolled back. */
class DryRunRollback extends Error {
  constructor(readonly result: unknown) {
    super('dry run')
  }
}

async function effectOf(tx: Tx, summaries: EvaluationSummary[]): Promise<LimitEffectItem[]> {
  const wanted = summaries.flatMap(s => [...s.raised.map(id => ({ id, event: 'raised' as const })), ...s.cleared.map(id => ({ id, event: 'cleared' as const }))])
  if (!wanted.length) return []
  const a = schema.alerts
  const rows = await tx.select({ id: a.id, airfieldCode: schema.airfields.code, designator: a.designator, kind: a.kind, profileId: a.profileId,
    value: a.value, limitValue: a.limitValue, unit: a.unit, message: a.message, clearReason: a.clearReason })
    .from(a).innerJoin(schema.airfields, eq(schema.airfields.id, a.airfieldId))
    .where(inArray(a.id, wanted.map(w => w.id)))
  const byId = new Map(rows.map(r => [r.id, r]))
  return wanted.flatMap(({ id, event }) => {
    const r = byId.get(id)
    if (!r) return []
    return [{ event, airfieldCode: r.airfieldCode, designator: r.designator, kind: r.kind, profileId: r.profileId,
      value: r.value, limitValue: r.limitValue, unit: r.unit, message: event === 'cleared' ? (r.clearReason ?? r.message) : r.message }]
  }).sort((x, y) => x.airfieldCode.localeCompare(y.airfieldCode) || x.designator.localeCompare(y.designator)
    || x.kind.localeCompare(y.kind) || x.profileId - y.profileId || x.event.localeCompare(y.event))
}

export async function saveLimitSet(db: DB, user: User, target: { airfieldId: number | null, designator: string | null },
  values: Partial<PartialLimits>, reason: string, options: { dryRun?: boolean } = {}) {
  const scopeKey = scopeKeyOf(target.airfieldId, target.designator)
  const run = () => transaction(async (tx) => {
    const t = schema.thresholdSets
    const [before] = await tx.select().from(t).where(eq(t.scopeKey, scopeKey)).for('update')
    const oldValues = valuesOf(before)
    const newValues = Object.fromEntries(LIMIT_KEYS.map(k => [k, k in values ? (values[k] ?? null) : (oldValues?.[k] ?? null)])) as PartialLimits
    const effectiveBefore = await effectiveAt(tx, target)
    const now = new Date()
    if (before) await tx.update(t).set({ ...newValues, updatedByUserId: user.id, updatedAt: now }).where(eq(t.id, before.id))
    else await tx.insert(t).values({ scopeKey, airfieldId: target.airfieldId, designator: target.designator, ...newValues, updatedByUserId: user.id, updatedAt: now })
    const effectiveAfter = await effectiveAt(tx, target)
    const [change] = await tx.insert(schema.thresholdChanges).values({
      scopeKey, airfieldId: target.airfieldId, designator: target.designator, changedByUserId: user.id, changedAt: now,
      reason, oldValues, newValues,
    }).$returningId()
    await recordAudit(tx, { user }, 'limits.change', 'threshold_set', scopeKey, { reason, oldValues, newValues, effectiveBefore, effectiveAfter })

    // The organisation set reaches every airfield with a profile in force; an override only its own.
    const p = schema.profiles
    const airfieldIds = target.airfieldId != null
      ? [target.airfieldId]
      : (await tx.selectDistinct({ id: p.airfieldId }).from(p).where(and(eq(p.status, 'active'), gt(p.validTo, now)))).map(r => r.id)
    const summaries: EvaluationSummary[] = []
    const cause = `after a limit change (${target.designator ? `runway end ${target.designator}` : target.airfieldId != null ? 'airfield' : 'organisation'}): ${reason}`
    for (const airfieldId of airfieldIds.sort((a, b) => a - b)) {
      summaries.push(await evaluateAirfield(tx, airfieldId, { trigger: 'limits.change', actor: { user }, cause, now }))
    }
    const effect = await effectOf(tx, summaries)
    const [alertCount] = await tx.select({ n: sql<number>`COUNT(*)` }).from(schema.alerts).where(eq(schema.alerts.state, 'active'))
    const result = {
      dryRun: options.dryRun === true, changeId: options.dryRun ? null : change!.id, scopeKey, oldValues, newValues,
      effectiveBefore, effectiveAfter, changedAt: now.toISOString(), activeAlerts: Number(alertCount?.n ?? 0),
      effect: { raised: effect.filter(e => e.event === 'raised'), cleared: effect.filter(e => e.event === 'cleared') },
      lowered: LIMIT_KEYS.filter(k => k !== 'nearLimitMarginPct' && effectiveAfter[k] < effectiveBefore[k]),
    }
    if (options.dryRun) throw new DryRunRollback(result)
    return result
  }, { db })
  try {
    return await run()
  }
  catch (err) {
    if (err instanceof DryRunRollback) return err.result as Awaited<ReturnType<typeof run>>
    throw err
  }
}

/** The limits in force at the changed scope (the organisation's, an airfield's, or one runway end's). */
async function effectiveAt(tx: Tx, target: { airfieldId: number | null, designator: string | null }) {
  const t = schema.thresholdSets
  const rows = target.airfieldId == null
    ? await tx.select().from(t).where(eq(t.scopeKey, 'org'))
    : await tx.select().from(t).where(sql`${t.scopeKey} = 'org' OR ${t.airfieldId} = ${target.airfieldId}`)
  const set = limitSetFromRows(rows, target.airfieldId ?? -1)
  return target.designator ? set.limitsFor(target.designator) : set.limits
}

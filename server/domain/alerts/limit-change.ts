// Saving a limit set: upsert the set, keep the change (who, when, why, old and new values), audit it and
// re-evaluate the affected airfields, all in one transaction.
import { and, eq, gt, schema, sql } from '../../utils/db'
import type { DB } from '../../utils/db'
import type { User } from '../../db/schema'
import { recordAudit } from '../../utils/audit'
import { evaluateAirfield } from './evaluate'
import { scopeKeyOf, valuesOf } from './limits'
import { LIMIT_KEYS, type PartialLimits } from './limit-sets'

export async function saveLimitSet(db: DB, user: User, target: { airfieldId: number | null, designator: string | null },
  values: Partial<PartialLimits>, reason: string) {
  const scopeKey = scopeKeyOf(target.airfieldId, target.designator)
  return db.transaction(async (tx) => {
    const t = schema.thresholdSets
    const [before] = await tx.select().from(t).where(eq(t.scopeKey, scopeKey)).for('update')
    const oldValues = valuesOf(before)
    const newValues = Object.fromEntries(LIMIT_KEYS.map(k => [k, k in values ? (values[k] ?? null) : (oldValues?.[k] ?? null)])) as PartialLimits
    const now = new Date()
    if (before) await tx.update(t).set({ ...newValues, updatedByUserId: user.id, updatedAt: now }).where(eq(t.id, before.id))
    else await tx.insert(t).values({ scopeKey, airfieldId: target.airfieldId, designator: target.designator, ...newValues, updatedByUserId: user.id, updatedAt: now })
    const [change] = await tx.insert(schema.thresholdChanges).values({
      scopeKey, airfieldId: target.airfieldId, designator: target.designator, changedByUserId: user.id, changedAt: now,
      reason, oldValues, newValues,
    }).$returningId()
    await recordAudit(tx, { user }, 'limits.change', 'threshold_set', scopeKey, { reason, oldValues, newValues })

    // The organisation set reaches every airfield with a profile in force; an override only its own.
    const p = schema.profiles
    const airfieldIds = target.airfieldId != null
      ? [target.airfieldId]
      : (await tx.selectDistinct({ id: p.airfieldId }).from(p).where(and(eq(p.status, 'active'), gt(p.validTo, now)))).map(r => r.id)
    for (const airfieldId of airfieldIds.sort((a, b) => a - b)) {
      await evaluateAirfield(tx, airfieldId, { trigger: 'limits.change', actor: { user } })
    }
    const [alertCount] = await tx.select({ n: sql<number>`COUNT(*)` }).from(schema.alerts).where(eq(schema.alerts.state, 'active'))
    return { changeId: change!.id, scopeKey, oldValues, newValues, changedAt: now.toISOString(), activeAlerts: Number(alertCount?.n ?? 0) }
  })
}

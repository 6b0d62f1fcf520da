import { DEFAULT_LIMITS, LIMIT_RANGES } from '../../../shared/limits'
import type { Airfield } from '../../db/schema'
import { and, desc, eq, schema, useDB } from '../../utils/db'
import { invalid } from '../../utils/errors'
import { layerLimits } from './limit-sets'
import { ORG_SCOPE, effectiveLimits, scopeKeyOf, valuesOf } from './limits'

/** Every limit set with what is in force: the organisation default and each airfield's override and runway ends. */
export async function limitsOverview() {
  const db = useDB()
  const [sets, airfields, ends] = await Promise.all([
    db.select().from(schema.thresholdSets),
    db.select({ id: schema.airfields.id, code: schema.airfields.code, name: schema.airfields.name }).from(schema.airfields).orderBy(schema.airfields.code),
    db.select({ airfieldId: schema.runwayEnds.airfieldId, designator: schema.runwayEnds.designator }).from(schema.runwayEnds),
  ])
  const org = valuesOf(sets.find(s => s.scopeKey === ORG_SCOPE))
  return {
    defaults: DEFAULT_LIMITS,
    ranges: LIMIT_RANGES,
    organisation: { values: org, effective: layerLimits([{ source: 'organisation', values: org }]).limits },
    airfields: await Promise.all(airfields.map(async (a) => {
      const eff = await effectiveLimits(a.id, db)
      return {
        code: a.code,
        name: a.name,
        values: valuesOf(sets.find(s => s.scopeKey === scopeKeyOf(a.id))),
        effective: eff.limits,
        source: eff.source,
        designators: ends.filter(e => e.airfieldId === a.id).map(e => e.designator).sort(),
        ends: sets.filter(s => s.airfieldId === a.id && s.designator).map(s => ({ designator: s.designator!, values: valuesOf(s), effective: eff.limitsFor(s.designator!) })),
      }
    })),
  }
}

/** Who changed which limits when, why, and from what to what; newest first. */
export async function limitHistory(filter: { airfieldId?: number, limit: number }) {
  const c = schema.thresholdChanges
  const rows = await useDB().select({ change: c, by: { name: schema.users.name, email: schema.users.email }, airfieldCode: schema.airfields.code })
    .from(c)
    .innerJoin(schema.users, eq(schema.users.id, c.changedByUserId))
    .leftJoin(schema.airfields, eq(schema.airfields.id, c.airfieldId))
    .where(filter.airfieldId ? eq(c.airfieldId, filter.airfieldId) : undefined)
    .orderBy(desc(c.changedAt), desc(c.id))
    .limit(filter.limit)
  return rows.map(r => ({
    id: r.change.id, scope: r.change.airfieldId == null ? 'organisation' : r.change.designator ? 'runway end' : 'airfield',
    airfieldCode: r.airfieldCode, designator: r.change.designator, changedAt: r.change.changedAt.toISOString(),
    changedBy: r.by, reason: r.change.reason, oldValues: r.change.oldValues, newValues: r.change.newValues,
  }))
}

/** A runway end named for its own limits must exist at the airfield (422 naming the field otherwise). */
export async function requireRunwayEnd(airfield: Airfield, designator: string) {
  const [end] = await useDB().select({ id: schema.runwayEnds.id }).from(schema.runwayEnds)
    .where(and(eq(schema.runwayEnds.airfieldId, airfield.id), eq(schema.runwayEnds.designator, designator)))
  if (!end) {
    const message = `${airfield.code} has no runway end ${designator}`
    throw invalid([{ field: 'designator', message }], message)
  }
}

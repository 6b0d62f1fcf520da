import { DEFAULT_LIMITS, LIMIT_RANGES, type Limits } from '../../../shared/limits'
import type { Airfield } from '../../db/schema'
import { and, asc, desc, eq, isNull, or, schema, useDB } from '../../utils/db'
import { invalid } from '../../utils/errors'
import { layerLimits, type LimitSource, type PartialLimits } from './limit-sets'
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
    organisation: { values: org, ...effectiveWithSource(layerLimits([{ source: 'organisation', values: org }])) },
    airfields: await Promise.all(airfields.map(async (a) => {
      const eff = await effectiveLimits(a.id, db)
      return {
        code: a.code,
        name: a.name,
        values: valuesOf(sets.find(s => s.scopeKey === scopeKeyOf(a.id))),
        effective: eff.limits,
        source: eff.source,
        designators: ends.filter(e => e.airfieldId === a.id).map(e => e.designator).sort(),
        // Every runway end with what is in force there and where each figure comes from (values: its own override).
        ends: ends.filter(e => e.airfieldId === a.id).map(e => e.designator).sort().map(d => ({
          designator: d,
          values: valuesOf(sets.find(s => s.scopeKey === scopeKeyOf(a.id, d))),
          effective: eff.limitsFor(d),
          source: eff.sourceFor(d),
        })),
      }
    })),
  }
}

function effectiveWithSource(set: { limits: Limits, source: Record<keyof Limits, LimitSource> }) {
  return { effective: set.limits, source: set.source }
}

interface ChangeRow { id: number, scopeKey: string, airfieldId: number | null, designator: string | null, newValues: PartialLimits | null }

/**
 * The limits in force at each change's own scope just before and just after it, by replaying every change in order
 * (a scope's set is what its latest change left). Pure: the history shows "effective 20 -> 12", not "inherit -> 12".
 */
export function effectiveAroundChanges(changesOldestFirst: ChangeRow[]) {
  const current = new Map<string, PartialLimits | null>()
  const at = (c: ChangeRow) => {
    const layers: { source: LimitSource, values: PartialLimits | null | undefined }[] = [{ source: 'organisation', values: current.get(ORG_SCOPE) }]
    if (c.airfieldId != null) layers.push({ source: 'airfield', values: current.get(scopeKeyOf(c.airfieldId)) })
    if (c.airfieldId != null && c.designator) layers.push({ source: 'runway end', values: current.get(scopeKeyOf(c.airfieldId, c.designator)) })
    return layerLimits(layers).limits
  }
  const out = new Map<number, { before: Limits, after: Limits }>()
  for (const c of changesOldestFirst) {
    const before = at(c)
    current.set(c.scopeKey, c.newValues)
    out.set(c.id, { before, after: at(c) })
  }
  return out
}

/** Who changed which limits when, why, and from what to what (as set, and as in force at that scope); newest first. */
export async function limitHistory(filter: { airfieldId?: number, limit: number }) {
  const c = schema.thresholdChanges
  const [rows, all] = await Promise.all([
    useDB().select({ change: c, by: { name: schema.users.name, email: schema.users.email }, airfieldCode: schema.airfields.code })
      .from(c)
      .innerJoin(schema.users, eq(schema.users.id, c.changedByUserId))
      .leftJoin(schema.airfields, eq(schema.airfields.id, c.airfieldId))
      .where(filter.airfieldId ? eq(c.airfieldId, filter.airfieldId) : undefined)
      .orderBy(desc(c.changedAt), desc(c.id))
      .limit(filter.limit),
    // The replay needs every change that can reach these scopes: the organisation's and the airfield's own.
    useDB().select({ id: c.id, scopeKey: c.scopeKey, airfieldId: c.airfieldId, designator: c.designator, newValues: c.newValues })
      .from(c)
      .where(filter.airfieldId ? or(isNull(c.airfieldId), eq(c.airfieldId, filter.airfieldId)) : undefined)
      .orderBy(asc(c.changedAt), asc(c.id)),
  ])
  const effective = effectiveAroundChanges(all as ChangeRow[])
  return rows.map(r => ({
    id: r.change.id, scope: r.change.airfieldId == null ? 'organisation' : r.change.designator ? 'runway end' : 'airfield',
    airfieldCode: r.airfieldCode, designator: r.change.designator, changedAt: r.change.changedAt.toISOString(),
    changedBy: r.by, reason: r.change.reason, oldValues: r.change.oldValues, newValues: r.change.newValues,
    effectiveBefore: effective.get(r.change.id)?.before ?? null, effectiveAfter: effective.get(r.change.id)?.after ?? null,
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

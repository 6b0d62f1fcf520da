import type { Limits } from '../../../shared/limits'
import { layerLimits, LIMIT_KEYS, type LimitSource, type PartialLimits } from './limit-sets'
import type { ThresholdSet } from '../../db/schema'
import { eq, or, schema, useDB } from '../../utils/db'
import type { DB, Tx } from '../../utils/db'

export const ORG_SCOPE = 'org'
export const scopeKeyOf = (airfieldId: number | null, designator?: string | null) =>
  airfieldId == null ? ORG_SCOPE : designator ? `airfield:${airfieldId}:${designator}` : `airfield:${airfieldId}`

export function valuesOf(set: ThresholdSet | null | undefined): PartialLimits | null {
  if (!set) return null
  return Object.fromEntries(LIMIT_KEYS.map(k => [k, set[k]])) as PartialLimits
}

/**
 * The limits in force at an airfield: built-in defaults, then the organisation set, then the airfield's
 * override, then (through limitsFor) a runway end's override. `source` names where each figure comes from.
 */
export async function effectiveLimits(airfieldId: number, db: DB | Tx = useDB()) {
  const t = schema.thresholdSets
  const rows = await db.select().from(t).where(or(eq(t.scopeKey, ORG_SCOPE), eq(t.airfieldId, airfieldId)))
  return limitSetFromRows(rows, airfieldId)
}

/** effectiveLimits from limit set rows already read (any others in `rows` are ignored). Pure. */
export function limitSetFromRows(rows: ThresholdSet[], airfieldId: number) {
  const org = rows.find(r => r.scopeKey === ORG_SCOPE)
  const field = rows.find(r => r.scopeKey === scopeKeyOf(airfieldId))
  const base: { source: LimitSource, values: PartialLimits | null }[] = [
    { source: 'organisation', values: valuesOf(org) },
    { source: 'airfield', values: valuesOf(field) },
  ]
  const { limits, source } = layerLimits(base)
  const ends = new Map(rows.filter(r => r.designator && r.airfieldId === airfieldId).map(r => [r.designator!, r]))
  const limitsFor = (designator: string): Limits => {
    const end = ends.get(designator)
    return end ? layerLimits([...base, { source: 'runway end', values: valuesOf(end) }]).limits : limits
  }
  const sourceFor = (designator: string) => {
    const end = ends.get(designator)
    return end ? layerLimits([...base, { source: 'runway end', values: valuesOf(end) }]).source : source
  }
  return { limits, limitsFor, source, sourceFor, endOverrides: [...ends.keys()] }
}

import { DEFAULT_LIMITS, LIMIT_RANGES } from '../../../shared/limits'
import { layerLimits } from '../../domain/alerts/limit-sets'
import { ORG_SCOPE, effectiveLimits, scopeKeyOf, valuesOf } from '../../domain/alerts/limits'

// Every limit set with what is in force: the organisation default and each airfield's override and runway ends.
export default defineApiHandler(async (event) => {
  await requireUser(event)
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
})

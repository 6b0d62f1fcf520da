import { airfieldCodeField } from '#shared/utils/airfield-schema'
import { z } from 'zod'
import { decimalIntSchema } from '#shared/utils/input-schemas'
import { loadAirfield } from '../../domain/airfields/lookup'

const querySchema = z.object({ airfield: airfieldCodeField('Airfield').optional(), limit: decimalIntSchema('limit', 1, 500).default(100) })

// Who changed which limits when, why, and from what to what.
export default defineApiHandler(async (event) => {
  await requireCapability(event, 'manage-limits')
  const query = readQuery(event, querySchema)
  const c = schema.thresholdChanges
  const airfield = query.airfield ? await loadAirfield(query.airfield) : null
  const rows = await useDB().select({ change: c, by: { name: schema.users.name, email: schema.users.email }, airfieldCode: schema.airfields.code })
    .from(c)
    .innerJoin(schema.users, eq(schema.users.id, c.changedByUserId))
    .leftJoin(schema.airfields, eq(schema.airfields.id, c.airfieldId))
    .where(airfield ? eq(c.airfieldId, airfield.id) : undefined)
    .orderBy(desc(c.changedAt), desc(c.id))
    .limit(query.limit)
  return {
    changes: rows.map(r => ({
      id: r.change.id, scope: r.change.airfieldId == null ? 'organisation' : r.change.designator ? 'runway end' : 'airfield',
      airfieldCode: r.airfieldCode, designator: r.change.designator, changedAt: r.change.changedAt.toISOString(),
      changedBy: r.by, reason: r.change.reason, oldValues: r.change.oldValues, newValues: r.change.newValues,
    })),
  }
})

import { airfieldCodeField } from '#shared/utils/airfield-schema'
import { z } from 'zod'
import { decimalIntSchema } from '#shared/utils/input-schemas'
import { loadAirfield } from '../../domain/airfields/lookup'

const querySchema = z.object({
  airfield: airfieldCodeField('Airfield').optional(),
  state: z.enum(['active', 'cleared', 'superseded', 'expired']).optional(),
  limit: decimalIntSchema('limit', 1, 500).default(100),
})

// The alert log: every alert with each of its deliveries (state, attempts, last error). Safety officers and admins.
export default defineApiHandler(async (event) => {
  await requireCapability(event, 'read-alert-log')
  const query = readQuery(event, querySchema)
  const a = schema.alerts
  const airfield = query.airfield ? await loadAirfield(query.airfield) : null
  const rows = await useDB().select({ alert: a, airfieldCode: schema.airfields.code, profile: { validFrom: schema.profiles.validFrom, validTo: schema.profiles.validTo } })
    .from(a)
    .innerJoin(schema.airfields, eq(schema.airfields.id, a.airfieldId))
    .innerJoin(schema.profiles, eq(schema.profiles.id, a.profileId))
    .where(and(airfield ? eq(a.airfieldId, airfield.id) : undefined, query.state ? eq(a.state, query.state) : undefined))
    .orderBy(desc(a.id))
    .limit(query.limit)
  const o = schema.outbox
  const deliveries = rows.length
    ? await useDB().select({ id: o.id, alertId: o.alertId, kind: o.kind, channel: o.channel, to: o.toAddress, userId: o.userId, state: o.state,
        attempts: o.attempts, lastError: o.lastError, nextAttemptAt: o.nextAttemptAt, sentAt: o.sentAt, sentBy: o.sentBy, createdAt: o.createdAt })
        .from(o).where(inArray(o.alertId, rows.map(r => r.alert.id))).orderBy(asc(o.id))
    : []
  return {
    alerts: rows.map(r => ({
      ...r.alert, airfieldCode: r.airfieldCode, validFrom: r.profile.validFrom, validTo: r.profile.validTo,
      deliveries: deliveries.filter(d => d.alertId === r.alert.id),
    })),
  }
})

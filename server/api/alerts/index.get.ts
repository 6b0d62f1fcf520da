import { airfieldCodeField } from '#shared/utils/airfield-schema'
import { z } from 'zod'
import { decimalIntSchema, pageSchema } from '#shared/utils/input-schemas'
import { loadAirfield } from '../../domain/airfields/lookup'
import { alertQueue, countAlerts, listAlerts } from '../../domain/alerts/alert-log'

const querySchema = z.object({
  airfield: airfieldCodeField('Airfield').optional(),
  state: z.enum(['active', 'cleared', 'superseded', 'expired']).optional(),
  kind: z.string().trim().regex(/^[a-z-]{1,32}$/, 'kind must be an alert kind such as crosswind').optional(),
  limit: decimalIntSchema('limit', 1, 500).default(100),
  delivery: z.enum(['failed'], { message: 'delivery must be failed (alerts with a notice that was not delivered)' }).optional(),
  page: pageSchema,
})

// The alert log: every alert with each of its deliveries (state, attempts, senders, last error), and the outbox
// queue (backlog, oldest due age, failed). Safety officers and admins.
export default defineApiHandler(async (event) => {
  await requireCapability(event, 'read-alert-log')
  const query = readQuery(event, querySchema)
  const airfield = query.airfield ? await loadAirfield(query.airfield) : null
  const filter = { airfieldId: airfield?.id, state: query.state, kind: query.kind, delivery: query.delivery, limit: query.limit, page: query.page }
  const [alerts, total, queue] = await Promise.all([listAlerts(filter), countAlerts(filter), alertQueue()])
  return { queue, alerts, total, page: query.page, pageSize: query.limit }
})

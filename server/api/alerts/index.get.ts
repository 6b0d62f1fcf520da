import { airfieldCodeField } from '#shared/utils/airfield-schema'
import { z } from 'zod'
import { decimalIntSchema } from '#shared/utils/input-schemas'
import { loadAirfield } from '../../domain/airfields/lookup'
import { alertQueue, listAlerts } from '../../domain/alerts/alert-log'

const querySchema = z.object({
  airfield: airfieldCodeField('Airfield').optional(),
  state: z.enum(['active', 'cleared', 'superseded', 'expired']).optional(),
  limit: decimalIntSchema('limit', 1, 500).default(100),
})

// The alert log: every alert with each of its deliveries (state, attempts, last error). Safety officers and admins.
export default defineApiHandler(async (event) => {
  await requireCapability(event, 'read-alert-log')
  const query = readQuery(event, querySchema)
  const airfield = query.airfield ? await loadAirfield(query.airfield) : null
  return { queue: await alertQueue(), alerts: await listAlerts({ airfieldId: airfield?.id, state: query.state, limit: query.limit }) }
})

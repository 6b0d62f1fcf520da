import { z } from 'zod'
import { decimalIntSchema } from '#shared/utils/input-schemas'
import { listDeliveries } from '../../../domain/alerts/alert-log'

const querySchema = z.object({
  state: z.enum(['queued', 'sent', 'failed']).optional(),
  kind: z.enum(['alert-raised', 'alert-cleared', 'invitation', 'password-reset']).optional(),
  limit: decimalIntSchema('limit', 1, 1000).default(200),
})

// The outbox itself, newest first: every notice (alerts, invitations, resets) and how its delivery stands.
export default defineApiHandler(async (event) => {
  await requireCapability(event, 'read-alert-log')
  const query = readQuery(event, querySchema)
  return { deliveries: await listDeliveries(query) }
})

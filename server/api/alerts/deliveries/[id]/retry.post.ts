import { idParamSchema } from '#shared/utils/schemas'
import { retryDelivery } from '../../../../domain/alerts/alert-log'

// Puts a failed delivery back in the queue, due now, with a fresh retry period (its attempts stay on record).
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'read-alert-log')
  const { id } = readParams(event, idParamSchema)
  return retryDelivery(user, id)
})

import { idParamSchema } from '#shared/utils/schemas'
import { removePushSubscription } from '../../../domain/alerts/push-subscriptions'

export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const { id } = readParams(event, idParamSchema)
  await removePushSubscription(user.id, id)
  setResponseStatus(event, 204)
  return null
})

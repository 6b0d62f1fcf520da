import { pushSubscriptionsOf } from '../../../domain/alerts/push-subscriptions'

export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  return { subscriptions: await pushSubscriptionsOf(user.id) }
})

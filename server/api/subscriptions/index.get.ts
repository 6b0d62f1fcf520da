import { subscriptionsOf } from '../../domain/alerts/subscriptions'

// The signed-in user's subscriptions (airfields x channels) and the airfields there are to choose from.
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  return subscriptionsOf(user.id)
})

import { unacknowledgedCount } from '../../../domain/alerts/inbox'

// How many inbox entries the signed-in user has not acknowledged (the badge in the navigation).
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  return { unacknowledged: await unacknowledgedCount(user.id) }
})

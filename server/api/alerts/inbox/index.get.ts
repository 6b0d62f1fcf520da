import { inboxOf } from '../../../domain/alerts/inbox'

// The signed-in user's alerts inbox, newest first, with the count not yet acknowledged.
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  return inboxOf(user.id)
})

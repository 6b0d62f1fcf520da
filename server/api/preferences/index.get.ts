import { preferencesOf } from '../../domain/accounts/preferences'
// The signed-in user's display preferences (defaults when never set).
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  return { preferences: await preferencesOf(user.id) }
})

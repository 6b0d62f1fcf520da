import { signOutEverywhere } from '../../domain/accounts/session-store'

// Signs the caller out everywhere: every session of the account ends, this one included.
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  await signOutEverywhere(user)
  await clearUserSession(event)
  setResponseStatus(event, 204)
  return null
})

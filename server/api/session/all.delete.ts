import { endUserSessions } from '../../domain/accounts/session-store'

// Signs the caller out everywhere: every session of the account ends, this one included.
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const ended = await endUserSessions(user.id)
  await recordAudit(useDB(), { user }, 'session.sign-out-everywhere', 'user', user.id, { ended })
  await clearUserSession(event)
  setResponseStatus(event, 204)
  return null
})

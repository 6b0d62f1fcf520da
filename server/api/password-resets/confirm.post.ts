import { acceptToken, acceptTokenSchema } from '../../domain/accounts/accept-token'
import { startSession } from '../../domain/accounts/session-store'

// Public: sets a new password with a single-use reset token (every other session of the account ends), then signs in.
export default defineApiHandler(async (event) => {
  const body = await readBodyWith(event, acceptTokenSchema, 'The password was not set')
  const user = await acceptToken('password-reset', body)
  await startSession(event, user, sessionUser(user))
  return { user: sessionUser(user) }
})

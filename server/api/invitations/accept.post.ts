import { acceptToken, acceptTokenSchema } from '../../domain/accounts/accept-token'
import { startSession } from '../../domain/accounts/session-store'

// Public: accepts an invitation with its single-use token and a new password, then signs the person in.
export default defineApiHandler(async (event) => {
  const body = await readBodyWith(event, acceptTokenSchema, 'The password was not set')
  const user = await acceptToken('invitation', body)
  await startSession(event, user, sessionUser(user))
  return { user: sessionUser(user) }
})

import { signInSchema } from '#shared/utils/schemas'
import { startSession } from '../../domain/accounts/session-store'
import { clientAddress } from '../../domain/accounts/sign-in-limit'
import { signIn } from '../../domain/accounts/sign-in'

// Signing in is the one route open to a signed-out caller.
export default defineApiHandler(async (event) => {
  const { email, password } = await readBodyWith(event, signInSchema, 'Enter an e-mail and a password')
  const result = await signIn(email, password, clientAddress(event))
  if (result.kind === 'locked') {
    setResponseHeader(event, 'Retry-After', result.waitS)
    const minutes = Math.ceil(result.waitS / 60)
    throw createError({
      statusCode: 429,
      statusMessage: `Too many failed sign-ins. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`,
      data: { retryAfterS: result.waitS },
    })
  }
  await startSession(event, result.user, sessionUser(result.user))
  return { user: sessionUser(result.user) }
})

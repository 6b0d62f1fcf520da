import { signInSchema } from '#shared/utils/schemas'
import { credentialsMatch } from '../../domain/accounts/credentials'
import { startSession } from '../../domain/accounts/session-store'
import { clientAddress, recordSignInFailure, signInWaitS } from '../../domain/accounts/sign-in-limit'

// Signing in is the one route open to a signed-out caller.
export default defineApiHandler(async (event) => {
  const { email, password } = await readBodyWith(event, signInSchema, 'Enter an e-mail and a password')
  const address = clientAddress(event)

  const waitS = await signInWaitS(email, address)
  if (waitS > 0) {
    setResponseHeader(event, 'Retry-After', waitS)
    const minutes = Math.ceil(waitS / 60)
    throw createError({
      statusCode: 429,
      statusMessage: `Too many failed sign-ins. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`,
      data: { retryAfterS: waitS },
    })
  }

  const [user] = await useDB().select().from(schema.users).where(eq(schema.users.email, email))
  const ok = await credentialsMatch(user, password, { hash: hashPassword, verify: verifyPassword })
  if (!user || !ok) {
    await recordSignInFailure(email, address)
    // One message whatever went wrong: no hint whether the e-mail exists.
    throw createError({ statusCode: 401, statusMessage: 'E-mail or password not recognised' })
  }
  await useDB().delete(schema.signInFailures).where(eq(schema.signInFailures.email, email))
  await recordAudit(useDB(), { user }, 'session.sign-in', 'user', user.id)
  await startSession(event, user, sessionUser(user))
  return { user: sessionUser(user) }
})

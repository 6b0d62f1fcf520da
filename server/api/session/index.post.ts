import { signInSchema } from '#shared/utils/schemas'
import { clientAddress, recordSignInFailure, signInWaitS } from '../../domain/accounts/sign-in-limit'

// Signing in is the one route open to a signed-out caller.
export default defineEventHandler(async (event) => {
  const body = await readValidatedBody(event, signInSchema.safeParse)
  if (!body.success) {
    throw createError({ statusCode: 400, statusMessage: 'Enter an e-mail and a password', data: { issues: body.error.issues } })
  }
  const { email, password } = body.data
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
  const ok = !!user?.passwordHash && !user.disabled && await verifyPassword(user.passwordHash, password)
  if (!user || !ok) {
    await recordSignInFailure(email, address)
    // One message whatever went wrong: no hint whether the e-mail exists.
    throw createError({ statusCode: 401, statusMessage: 'E-mail or password not recognised' })
  }
  await useDB().delete(schema.signInFailures).where(eq(schema.signInFailures.email, email))
  await replaceUserSession(event, { user: sessionUser(user), signedInAt: new Date().toISOString() })
  await recordAudit(useDB(), { user }, 'session.sign-in', 'user', user.id)
  return { user: sessionUser(user) }
})

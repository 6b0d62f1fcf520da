import { z } from 'zod'
import { emailSchema } from '#shared/utils/schemas'
import { issueToken } from '../../domain/accounts/tokens'

const bodySchema = z.object({ email: emailSchema })
const RESET_WINDOW_MS = 15 * 60 * 1000
const RESET_MAX_PER_WINDOW = 3

// Public: asks for a reset link. The answer is the same whether or not the address has an account.
export default defineApiHandler(async (event) => {
  const body = await readBodyWith(event, bodySchema, 'Enter the e-mail address of your account')
  const appUrl = process.env.NUXT_PUBLIC_APP_URL || useRuntimeConfig().public.appUrl
  await useDB().transaction(async (tx) => {
    const [user] = await tx.select().from(schema.users).where(eq(schema.users.email, body.email)).for('update')
    // At most 3 links per account per 15 minutes, so the address cannot be flooded; the answer stays the same.
    // The count runs for an unknown address too (for no user), so both take the same reads.
    const t = schema.userTokens
    const [recent] = await tx.select({ n: sql<number>`COUNT(*)` }).from(t)
      .where(and(eq(t.userId, user?.id ?? 0), eq(t.purpose, 'password-reset'), gte(t.createdAt, new Date(Date.now() - RESET_WINDOW_MS))))
    if (!user || user.disabled || !user.passwordHash) return
    if (Number(recent?.n ?? 0) >= RESET_MAX_PER_WINDOW) return
    await issueToken(tx, 'password-reset', user, appUrl)
    await recordAudit(tx, { label: 'password-reset request', userId: user.id }, 'user.request-reset', 'user', user.id)
  })
  setResponseStatus(event, 202)
  return { message: 'If the address has an account, a reset link is on its way. It works once, within an hour.' }
})

import { z } from 'zod'
import { emailSchema } from '#shared/utils/schemas'
import { issueToken } from '../../utils/alerts/tokens'

const bodySchema = z.object({ email: emailSchema })

// Public: asks for a reset link. The answer is the same whether or not the address has an account.
export default defineEventHandler(async (event) => {
  const body = await readValidatedBody(event, bodySchema.safeParse)
  if (!body.success) throw validationError(body.error, 'Enter the e-mail address of your account')
  const appUrl = process.env.NUXT_PUBLIC_APP_URL || useRuntimeConfig().public.appUrl
  await useDB().transaction(async (tx) => {
    const [user] = await tx.select().from(schema.users).where(eq(schema.users.email, body.data.email)).for('update')
    if (!user || user.disabled || !user.passwordHash) return
    await issueToken(tx, 'password-reset', user, appUrl)
    await recordAudit(tx, { label: 'password-reset request', userId: user.id }, 'user.request-reset', 'user', user.id)
  })
  setResponseStatus(event, 202)
  return { message: 'If the address has an account, a reset link is on its way. It works once, within an hour.' }
})

import { z } from 'zod'
import { emailSchema } from '#shared/utils/schemas'
import { requestPasswordReset } from '../../domain/accounts/sign-in'

const bodySchema = z.object({ email: emailSchema })

// Public: asks for a reset link. The answer is the same whether or not the address has an account.
export default defineApiHandler(async (event) => {
  const body = await readBodyWith(event, bodySchema, 'Enter the e-mail address of your account')
  const appUrl = process.env.NUXT_PUBLIC_APP_URL || useRuntimeConfig().public.appUrl
  // Answered before the work is done, the same for every address; a failure is logged, never shown to the caller.
  event.waitUntil(requestPasswordReset(body.email, appUrl).catch((err) => {
    console.error('[veerline] password reset request failed:', (err as Error).message)
  }))
  setResponseStatus(event, 202)
  return { message: 'If the address has an account, a reset link is on its way. It works once, within an hour.' }
})

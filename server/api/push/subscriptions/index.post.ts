import { z } from 'zod'
import { checkPushEndpoint } from '../../../domain/alerts/push-endpoint'
import { endpointRules } from '../../../domain/alerts/push'
import { registerPushSubscription } from '../../../domain/alerts/push-subscriptions'

const bodySchema = z.object({
  endpoint: z.string({ required_error: 'endpoint is required' }).max(500, 'endpoint must be at most 500 characters')
    .superRefine((u, ctx) => {
      const verdict = checkPushEndpoint(u, endpointRules())
      if (!verdict.ok) ctx.addIssue({ code: z.ZodIssueCode.custom, message: verdict.message })
    }),
  keys: z.object({
    p256dh: z.string().regex(/^[A-Za-z0-9_-]{80,100}$/, 'keys.p256dh must be a base64url P-256 public key'),
    auth: z.string().regex(/^[A-Za-z0-9_-]{16,40}$/, 'keys.auth must be a base64url secret'),
  }),
  label: z.string().trim().max(120).optional(),
})

// Registers a browser's Push API subscription (PushSubscription.toJSON()) for the signed-in user.
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const body = await readBodyWith(event, bodySchema, 'The push subscription was not saved')
  const saved = await registerPushSubscription(user, body)
  setResponseStatus(event, 201)
  return saved
})

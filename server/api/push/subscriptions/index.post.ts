import { z } from 'zod'
import { checkPushEndpoint } from '../../../domain/alerts/push-endpoint'
import { endpointRules } from '../../../domain/alerts/push'

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

// Registers a browser's Push API subscription (PushSubscription.toJSON()) for the signed-in user. An endpoint belongs
// to one user: the same browser registering again updates its keys; another user's endpoint is 409.
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const { endpoint, keys, label } = await readBodyWith(event, bodySchema, 'The push subscription was not saved')
  const p = schema.pushSubscriptions
  const values = { p256dh: keys.p256dh, auth: keys.auth, label: label || 'Browser' }
  const taken = () => createError({
    statusCode: 409, statusMessage: 'This push endpoint is registered to another account; nothing was changed',
    data: { issues: [{ field: 'endpoint', message: 'is registered to another account' }] },
  })
  const row = await useDB().transaction(async (tx) => {
    const [existing] = await tx.select().from(p).where(eq(p.endpoint, endpoint)).for('update')
    if (existing && existing.userId !== user.id) throw taken()
    if (existing) {
      await tx.update(p).set(values).where(and(eq(p.id, existing.id), eq(p.userId, user.id)))
      return { ...existing, ...values }
    }
    const [made] = await tx.insert(p).values({ userId: user.id, endpoint, ...values }).$returningId()
    return { id: made!.id, ...values }
  }).catch((err) => {
    // Two accounts registering the same endpoint at once: the unique index lets one in.
    if (isDuplicateKeyError(err)) throw taken()
    throw err
  })
  setResponseStatus(event, 201)
  return { id: row.id, label: row.label, endpoint }
})

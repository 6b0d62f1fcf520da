import { z } from 'zod'

const bodySchema = z.object({
  endpoint: z.string().url('endpoint must be a URL').max(500).refine(u => /^https?:\/\//.test(u), 'endpoint must be http(s)'),
  keys: z.object({
    p256dh: z.string().regex(/^[A-Za-z0-9_-]{80,100}$/, 'keys.p256dh must be a base64url P-256 public key'),
    auth: z.string().regex(/^[A-Za-z0-9_-]{16,40}$/, 'keys.auth must be a base64url secret'),
  }),
  label: z.string().trim().max(120).optional(),
})

// Registers a browser's Push API subscription (PushSubscription.toJSON()) for the signed-in user.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const body = await readValidatedBody(event, bodySchema.safeParse)
  if (!body.success) throw validationError(body.error, 'The push subscription was not saved')
  const { endpoint, keys, label } = body.data
  const values = { userId: user.id, endpoint, p256dh: keys.p256dh, auth: keys.auth, label: label || 'Browser' }
  await useDB().insert(schema.pushSubscriptions).values(values).onDuplicateKeyUpdate({ set: values })
  const [row] = await useDB().select().from(schema.pushSubscriptions).where(eq(schema.pushSubscriptions.endpoint, endpoint))
  setResponseStatus(event, 201)
  return { id: row!.id, label: row!.label, endpoint }
})

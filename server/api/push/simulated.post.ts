import { z } from 'zod'
import { pushStandinUrl } from '../../domain/standins/push-device'
import { standinsEnabled } from '../../domain/alerts/standins'

const bodySchema = z.object({ label: z.string().trim().min(1).max(120).default('Simulated device') }).default({})

// Makes a simulated device: the local push-service stand-in issues a subscription (keeping its private key so it can
// decrypt what arrives) and it is saved as one of the user's push subscriptions.
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  if (!standinsEnabled()) throw notFound('There is no push-service stand-in in production')
  const body = await readBodyWith(event, bodySchema)
  let issued: { id: string, endpoint: string, keys: { p256dh: string, auth: string } }
  try {
    const res = await fetch(`${pushStandinUrl()}/subscriptions`, { method: 'POST', body: JSON.stringify({ label: `${body.label} (${user.email})` }), signal: AbortSignal.timeout(5000) })
    if (res.status !== 201) throw new Error(`answered ${res.status}`)
    issued = await res.json()
  }
  catch (err) {
    throw createError({ statusCode: 503, statusMessage: `The local push-service stand-in at ${pushStandinUrl()} is not answering (${(err as Error).message}); start it with npm start` })
  }
  const [row] = await useDB().insert(schema.pushSubscriptions).values({ userId: user.id, endpoint: issued.endpoint, p256dh: issued.keys.p256dh, auth: issued.keys.auth, label: body.label }).$returningId()
  setResponseStatus(event, 201)
  return { id: row!.id, label: body.label, endpoint: issued.endpoint, standinId: issued.id }
})

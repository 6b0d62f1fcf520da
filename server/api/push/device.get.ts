import { pushStandinUrl } from '../../domain/standins/push-device'
import { standinsEnabled } from '../../domain/alerts/standins'

// What the push-service stand-in received (verified and decrypted) for the signed-in user's simulated devices.
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  if (!standinsEnabled()) throw createError({ statusCode: 404, statusMessage: 'There is no push-service stand-in in production' })
  const p = schema.pushSubscriptions
  const mine = await useDB().select({ id: p.id, label: p.label, endpoint: p.endpoint }).from(p).where(eq(p.userId, user.id))
  const base = pushStandinUrl()
  const simulated = mine.filter(s => s.endpoint.startsWith(`${base}/push/`))
  const ids = new Set(simulated.map(s => s.endpoint.slice(`${base}/push/`.length)))
  let messages: { subscriptionId: string }[] = []
  let reachable = true
  try {
    const res = await fetch(`${base}/messages`, { signal: AbortSignal.timeout(5000) })
    messages = (await res.json()).messages
  }
  catch {
    reachable = false
  }
  return {
    standin: base, reachable,
    devices: simulated.map(s => ({ id: s.id, label: s.label, endpoint: s.endpoint })),
    messages: messages.filter(m => ids.has(m.subscriptionId)).reverse(),
  }
})

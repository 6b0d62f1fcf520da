// Web push (RFC 8030) with VAPID (RFC 8292) and aes128gcm payloads (RFC 8291) through the web-push library.
// The VAPID key pair is made on first start and kept in app_meta, so every instance signs with the same key.
import webpush from 'web-push'
import { eq, schema } from '../../utils/db'
import type { DB } from '../../utils/db'

const META_KEY = 'vapid-keys'
let cached: { publicKey: string, privateKey: string } | undefined

export async function vapidKeys(db: DB) {
  if (cached) return cached
  const read = async () => {
    const [row] = await db.select().from(schema.appMeta).where(eq(schema.appMeta.key, META_KEY))
    return row ? JSON.parse(row.value) as { publicKey: string, privateKey: string } : undefined
  }
  let keys = await read()
  if (!keys) {
    const fresh = webpush.generateVAPIDKeys()
    // Two instances starting together: the first insert wins and both read it back.
    await db.insert(schema.appMeta).values({ key: META_KEY, value: JSON.stringify(fresh) }).onDuplicateKeyUpdate({ set: { key: META_KEY } })
    keys = await read()
  }
  cached = keys!
  return cached
}

export const vapidSubject = () => process.env.VEERLINE_VAPID_SUBJECT || 'mailto:alerts@veerline.example'

export class PushGoneError extends Error {}

export async function sendPush(db: DB, sub: { endpoint: string, p256dh: string, auth: string }, payload: unknown) {
  const keys = await vapidKeys(db)
  const details = webpush.generateRequestDetails({ endpoint: sub.endpoint, keys: { p256dh: sub.p256dh, auth: sub.auth } },
    JSON.stringify(payload), {
      vapidDetails: { subject: vapidSubject(), publicKey: keys.publicKey, privateKey: keys.privateKey },
      TTL: 3600, urgency: 'high', contentEncoding: 'aes128gcm',
    })
  // Sent with fetch rather than sendNotification: the same request works for an https push service and the
  // plain-http loopback stand-in.
  const res = await fetch(details.endpoint, {
    method: details.method, headers: details.headers as Record<string, string>, body: details.body ? new Uint8Array(details.body) : undefined,
    signal: AbortSignal.timeout(10_000),
  })
  if (res.status === 404 || res.status === 410) throw new PushGoneError(`the push service no longer knows this subscription (${res.status})`)
  if (res.status < 200 || res.status > 299) throw new Error(`the push service answered ${res.status}: ${(await res.text()).slice(0, 200)}`)
}

// Web push (RFC 8030) with VAPID (RFC 8292) and aes128gcm payloads (RFC 8291): web-push builds the request, we send it
// under the endpoint rules of push-endpoint.ts.
// The VAPID key pair is made on first start and kept in app_meta, so every instance signs with the same key.
import { lookup } from 'node:dns/promises'
import { request as httpRequest, type RequestOptions } from 'node:http'
import { request as httpsRequest } from 'node:https'
import webpush from 'web-push'
import { checkPushEndpoint, nonPublicReason, pushHostAllowList, shortFailure, type EndpointRules } from './push-endpoint'
import { pushStandinUrl } from '../standins/push-device'
import { standinsEnabled } from './standins'
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
/** A send refused by our own rules (endpoint not allowed, address not public): retrying will not help. */
export class PushRefusedError extends Error {}

export const PUSH_TIMEOUT_MS = 5_000

export function endpointRules(): EndpointRules {
  return { allowList: pushHostAllowList(), standinOrigin: standinsEnabled() ? new URL(pushStandinUrl()).origin : null }
}

/**
 * `deliveryId` also goes out as the RFC 8030 Topic (32 base64url characters: the UUID without its hyphens), so a push
 * service that still holds an undelivered copy replaces it instead of delivering it twice.
 */
export async function sendPush(db: DB, sub: { endpoint: string, p256dh: string, auth: string }, payload: unknown, deliveryId?: string) {
  const verdict = checkPushEndpoint(sub.endpoint, endpointRules())
  if (!verdict.ok) throw new PushRefusedError(`not sent: ${verdict.message}`)
  const keys = await vapidKeys(db)
  const details = webpush.generateRequestDetails({ endpoint: sub.endpoint, keys: { p256dh: sub.p256dh, auth: sub.auth } },
    JSON.stringify(payload), {
      vapidDetails: { subject: vapidSubject(), publicKey: keys.publicKey, privateKey: keys.privateKey },
      TTL: 3600, urgency: 'high', contentEncoding: 'aes128gcm',
      ...(deliveryId ? { topic: deliveryId.replace(/-/g, '') } : {}),
    })
  const status = await postOnce(verdict.url, verdict.standin, details.headers as Record<string, string>, details.body ? Buffer.from(details.body) : undefined)
  if (status.code === 404 || status.code === 410) throw new PushGoneError(`the push service no longer knows this subscription (${status.code})`)
  if (status.code < 200 || status.code > 299) throw new Error(shortFailure(status.code, status.text))
}

type Resolver = (host: string, options: { all: true }) => Promise<{ address: string, family: number }[]>

/** The first address of `host` when every address it resolves to is public; PushRefusedError otherwise. */
export async function publicAddressOf(host: string, resolve: Resolver = lookup): Promise<{ address: string, family: number }> {
  const found = await resolve(host, { all: true }).catch((err: NodeJS.ErrnoException) => {
    throw new Error(`not sent: the push service's name did not resolve (${err.code ?? 'lookup failed'})`)
  })
  const bad = found.map(a => ({ a, why: nonPublicReason(a.address) })).find(x => x.why)
  if (bad || !found.length) throw new PushRefusedError(`not sent: ${host} resolves to ${bad ? `${bad.why} (${bad.a.address})` : 'no address'}`)
  return found[0]!
}

/**
 * One POST, no redirects followed, a short timeout, the reply body discarded. For a push service the host is
 * resolved here and every address checked; the connection goes to the checked address (no second lookup that a
 * rebinding name server could answer differently).
 */
async function postOnce(url: URL, standin: boolean, headers: Record<string, string>, body: Buffer | undefined): Promise<{ code: number, text: string }> {
  const address = standin ? undefined : await publicAddressOf(url.hostname)
  const options: RequestOptions = {
    method: 'POST', headers: { ...headers, 'content-length': String(body?.length ?? 0) }, timeout: PUSH_TIMEOUT_MS,
    ...(address ? { lookup: ((_h: string, _o: unknown, cb: (e: null, a: string, f: number) => void) => cb(null, address!.address, address!.family)) as unknown as RequestOptions['lookup'] } : {}),
  }
  return new Promise((resolve, reject) => {
    const req = (url.protocol === 'https:' ? httpsRequest : httpRequest)(url, options, (res) => {
      res.resume()
      resolve({ code: res.statusCode ?? 0, text: res.statusMessage ?? '' })
    })
    req.on('timeout', () => req.destroy(new Error(`not delivered: the push service did not answer within ${PUSH_TIMEOUT_MS / 1000} s`)))
    req.on('error', (err: NodeJS.ErrnoException) => reject(new Error(err.message.startsWith('not delivered') ? err.message : `not delivered: ${err.code ?? 'connection failed'}`)))
    req.end(body)
  })
}

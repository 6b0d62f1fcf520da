// Local push-service stand-in (RFC 8030) on http://127.0.0.1:$VEERLINE_PUSH_PORT. It issues subscriptions (keeping
// each one's private key), takes pushes for them, checks the VAPID JWT (RFC 8292, ES256) and decrypts the aes128gcm
// payload (RFC 8291) with http_ece. Subscriptions are kept in $VEERLINE_DATA_DIR/standins/push-subscriptions.json;
// every message is appended, one JSON line each, to standins/pushbox.jsonl (never a whole-file rewrite) and kept.
//   POST /subscriptions {label}  -> 201 {id, endpoint, keys: {p256dh, auth}}
//   POST /push/<id>              -> 201 (the push message), 404 unknown subscription, 401 bad VAPID, 400 bad payload
//   GET  /messages[?subscription=<id>[,<id>…]&page=1&pageSize=200] -> {messages (newest first), total, page, pageSize}
//   GET  /healthz
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http'
import { createECDH, createPublicKey, randomBytes, randomUUID, verify } from 'node:crypto'
import { writeFileSync } from 'node:fs'
import { join } from 'node:path'
// @ts-expect-error http_ece ships no types
import ece from 'http_ece'
import { appendJsonLine, controlNumber, pushPort, readJson, readJsonLines, rotateIfLarge, standinDir, writeJson } from './lib/common'

interface Subscription { id: string, label: string, publicKey: string, privateKey: string, auth: string, createdAt: string }
export interface PushMessage {
  id: string
  subscriptionId: string
  label: string
  receivedAt: string
  ttl: number | null
  urgency: string | null
  vapid: { verified: boolean, subject: string | null, audience: string | null, publicKey: string | null }
  payload: unknown
}
const port = pushPort()
const origin = `http://127.0.0.1:${port}`
const subscriptionsFile = join(standinDir(), 'push-subscriptions.json')
const messagesFile = join(standinDir(), 'pushbox.jsonl')
// Milliseconds to hold each push before answering (a number in standins/push-delay-ms; the fan-out bench uses it to
// stand for a remote service's round trip).
const delayFile = join(standinDir(), 'push-delay-ms')
const subscriptions = new Map(readJson<Subscription[]>(subscriptionsFile, []).map(s => [s.id, s]))
let messages: PushMessage[] = []
const b64u = (b: Buffer) => b.toString('base64url')

/** Checks `Authorization: vapid t=<jwt>, k=<key>` (RFC 8292): ES256 signature, audience, expiry within 24 h. */
export function checkVapid(header: string | undefined, audience: string, nowS = Date.now() / 1000) {
  const m = /^vapid\s+t=([^,\s]+),\s*k=([A-Za-z0-9_-]+)\s*$/.exec(header ?? '')
  if (!m) throw new Error('missing or malformed "Authorization: vapid t=…, k=…" header')
  const [, jwt, k] = m
  const [h, p, s] = jwt!.split('.')
  if (!h || !p || !s) throw new Error('the VAPID token is not a JWT')
  const head = JSON.parse(Buffer.from(h, 'base64url').toString())
  if (head.alg !== 'ES256') throw new Error(`the VAPID token must be signed with ES256, not ${head.alg}`)
  const point = Buffer.from(k!, 'base64url')
  if (point.length !== 65 || point[0] !== 4) throw new Error('the VAPID public key is not an uncompressed P-256 point')
  const key = createPublicKey({ key: { kty: 'EC', crv: 'P-256', x: b64u(point.subarray(1, 33)), y: b64u(point.subarray(33)) }, format: 'jwk' })
  const ok = verify('sha256', Buffer.from(`${h}.${p}`), { key, dsaEncoding: 'ieee-p1363' }, Buffer.from(s, 'base64url'))
  if (!ok) throw new Error('the VAPID signature does not verify')
  const claims = JSON.parse(Buffer.from(p, 'base64url').toString())
  if (claims.aud !== audience) throw new Error(`the VAPID audience is ${claims.aud}, expected ${audience}`)
  if (typeof claims.exp !== 'number' || claims.exp < nowS || claims.exp > nowS + 24 * 3600) throw new Error('the VAPID token is expired or lasts more than 24 hours')
  return { subject: claims.sub ?? null, audience: claims.aud, publicKey: k! }
}

async function body(req: IncomingMessage, max = 8192) {
  const chunks: Buffer[] = []
  let size = 0
  for await (const c of req) {
    size += (c as Buffer).length
    if (size > max) throw new Error('too large')
    chunks.push(c as Buffer)
  }
  return Buffer.concat(chunks)
}

function send(res: ServerResponse, status: number, value?: unknown, headers: Record<string, string> = {}) {
  res.writeHead(status, { 'content-type': 'application/json', ...headers })
  res.end(value === undefined ? '' : JSON.stringify(value))
}

const server = createServer(async (req, res) => {
  const url = new URL(req.url ?? '/', origin)
  try {
    if (req.method === 'GET' && url.pathname === '/healthz') return send(res, 200, { ok: true })
    if (req.method === 'POST' && url.pathname === '/subscriptions') {
      const raw = await body(req)
      const label = String((raw.length ? JSON.parse(raw.toString()) : {}).label ?? 'Simulated device').slice(0, 120)
      const ecdh = createECDH('prime256v1')
      ecdh.generateKeys()
      const sub: Subscription = { id: randomUUID(), label, publicKey: b64u(ecdh.getPublicKey()), privateKey: b64u(ecdh.getPrivateKey()), auth: b64u(randomBytes(16)), createdAt: new Date().toISOString() }
      subscriptions.set(sub.id, sub)
      writeJson(subscriptionsFile, [...subscriptions.values()])
      return send(res, 201, { id: sub.id, endpoint: `${origin}/push/${sub.id}`, keys: { p256dh: sub.publicKey, auth: sub.auth } })
    }
    if (req.method === 'GET' && url.pathname === '/messages') {
      const only = url.searchParams.get('subscription')
      const ids = only ? new Set(only.split(',')) : null
      const page = Math.max(1, Math.floor(Number(url.searchParams.get('page')) || 1))
      const pageSize = Math.min(1000, Math.max(1, Math.floor(Number(url.searchParams.get('pageSize')) || 200)))
      const matching = ids ? messages.filter(m => ids.has(m.subscriptionId)) : messages
      const newestFirst = matching.slice(Math.max(0, matching.length - page * pageSize), matching.length - (page - 1) * pageSize).reverse()
      return send(res, 200, { messages: newestFirst, total: matching.length, page, pageSize })
    }
    const push = /^\/push\/([0-9a-f-]{36})$/.exec(url.pathname)
    if (req.method === 'POST' && push) {
      const raw = await body(req)
      const delayMs = controlNumber(delayFile)
      if (delayMs) await new Promise(r => setTimeout(r, delayMs))
      const sub = subscriptions.get(push[1]!)
      if (!sub) return send(res, 404, { error: 'no such subscription' })
      let vapid
      try {
        vapid = checkVapid(req.headers.authorization, origin)
      }
      catch (err) {
        return send(res, 401, { error: (err as Error).message })
      }
      if (req.headers['content-encoding'] !== 'aes128gcm') return send(res, 415, { error: 'Content-Encoding must be aes128gcm' })
      const ecdh = createECDH('prime256v1')
      ecdh.setPrivateKey(Buffer.from(sub.privateKey, 'base64url'))
      let payload: unknown
      try {
        const plain: Buffer = ece.decrypt(raw, { version: 'aes128gcm', privateKey: ecdh, authSecret: sub.auth })
        const text = plain.toString('utf8')
        try {
          payload = JSON.parse(text)
        }
        catch {
          payload = text
        }
      }
      catch (err) {
        return send(res, 400, { error: `the payload does not decrypt: ${(err as Error).message}` })
      }
      const message: PushMessage = {
        id: randomUUID(), subscriptionId: sub.id, label: sub.label, receivedAt: new Date().toISOString(),
        ttl: req.headers.ttl ? Number(req.headers.ttl) : null, urgency: (req.headers.urgency as string) ?? null,
        vapid: { verified: true, ...vapid }, payload,
      }
      messages.push(message)
      appendJsonLine(messagesFile, message)
      return send(res, 201, undefined, { location: `${origin}/messages/${message.id}` })
    }
    send(res, 404, { error: 'not found' })
  }
  catch (err) {
    send(res, 400, { error: (err as Error).message })
  }
})

if (process.argv[1]?.endsWith('push.ts')) {
  rotateIfLarge(messagesFile)
  messages = readJsonLines<PushMessage>(messagesFile)
  server.listen(port, '127.0.0.1', () => console.log(`[push stand-in] listening on ${origin}, keeping messages in ${messagesFile}`))
  process.on('SIGTERM', () => server.close(() => process.exit(0)))
  writeFileSync(join(standinDir(), 'push.pid'), String(process.pid))
}

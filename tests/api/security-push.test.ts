// Push endpoints (issue "Safe to deploy", point 1): the server-side request forgery and takeover cases.
// References: RFC 8030 §5 (a push message is a POST to the subscription's push resource), the W3C Push API
// (PushSubscription.endpoint is a URL of the browser's push service), RFC 1918 / RFC 3927 / RFC 4193 / RFC 5735
// (private, link-local, unique local and loopback ranges), OWASP SSRF Prevention Cheat Sheet (allow-list hosts,
// check resolved addresses, follow no redirects).
import { createServer, type Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import { createECDH, randomBytes } from 'node:crypto'
import mysql from 'mysql2/promise'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { ApiClient } from '../support/api'
import { signedIn } from '../support/api'
import { createTestAirfield, newUser, waitFor, windProfile } from '../support/alerts'

let admin: ApiClient, safety: ApiClient, dispatcher: ApiClient
let db: mysql.Connection
// A target on loopback that must never hear from Veerline; it answers with a body that must never be stored.
let target: Server
let hits = 0
const SECRET_REPLY = `internal-secret-${randomBytes(6).toString('hex')}`
beforeAll(async () => {
  admin = await signedIn('admin')
  safety = await signedIn('safety')
  dispatcher = await signedIn('dispatcher')
  db = await mysql.createConnection({ uri: process.env.DATABASE_URL!, timezone: 'Z' })
  target = createServer((req, res) => {
    hits++
    res.writeHead(500, { 'content-type': 'text/plain' })
    res.end(SECRET_REPLY)
  })
  await new Promise<void>(r => target.listen(0, '127.0.0.1', r))
})
afterAll(async () => {
  await db?.end()
  await new Promise(r => target?.close(r))
})

// The shapes PushSubscription.toJSON() gives: an uncompressed P-256 public key and a 16-byte secret, base64url.
const ecdh = createECDH('prime256v1')
const keys = { p256dh: ecdh.generateKeys().toString('base64url'), auth: randomBytes(16).toString('base64url') }
const register = (c: ApiClient, endpoint: string) => c.post('/api/push/subscriptions', { endpoint, keys, label: 'Test browser' })
const targetUrl = () => `http://127.0.0.1:${(target.address() as AddressInfo).port}/push/x`

describe('push endpoints: only https push services', () => {
  it('refuses loopback, private, link-local, metadata, plain http, other ports and unknown hosts at registration', async () => {
    const pilot = await signedIn('pilot')
    const refused = [
      targetUrl(),
      'https://127.0.0.1/push',
      'https://[::1]/push',
      'https://10.1.2.3/push',
      'https://169.254.169.254/latest/meta-data',
      'http://fcm.googleapis.com/fcm/send/abc',
      'https://fcm.googleapis.com:8443/fcm/send/abc',
      'https://user:pw@fcm.googleapis.com/fcm/send/abc',
      'https://evil.example/push',
      'https://fcm.googleapis.com.evil.example/fcm/send/abc',
      'ftp://fcm.googleapis.com/x',
      'not a url',
    ]
    for (const endpoint of refused) {
      const res = await register(pilot, endpoint)
      expect(res.status, endpoint).toBe(422)
      expect(res.body.data.issues[0].field, endpoint).toBe('endpoint')
    }
    expect(hits).toBe(0)
  })

  it('takes the hosted services\' endpoints (the documented default allow-list)', async () => {
    const pilot = await newUser(admin, 'pilot', 'pushok')
    for (const endpoint of [
      `https://fcm.googleapis.com/fcm/send/${randomBytes(8).toString('hex')}`,
      `https://updates.push.services.mozilla.com/wpush/v2/${randomBytes(8).toString('hex')}`,
      `https://web.push.apple.com/${randomBytes(8).toString('hex')}`,
      `https://wns2-par02p.notify.windows.com/w/?token=${randomBytes(8).toString('hex')}`,
    ]) {
      const res = await register(pilot.client, endpoint)
      expect(res.status, endpoint).toBe(201)
    }
  })

  it('an endpoint belongs to one user: another user\'s endpoint is 409 and stays theirs', async () => {
    const a = await newUser(admin, 'pilot', 'pusha')
    const b = await newUser(admin, 'pilot', 'pushb')
    const endpoint = `https://fcm.googleapis.com/fcm/send/${randomBytes(12).toString('hex')}`
    expect((await register(a.client, endpoint)).status).toBe(201)
    // The same browser registering again is fine.
    expect((await register(a.client, endpoint)).status).toBe(201)
    const taken = await register(b.client, endpoint)
    expect(taken.status).toBe(409)
    const [rows] = await db.query('SELECT user_id AS userId FROM push_subscriptions WHERE endpoint = ?', [endpoint]) as unknown as [{ userId: number }[]]
    expect(rows).toEqual([{ userId: a.id }])
  })
})

describe('push endpoints: checked again when sending', () => {
  // The test server's allow-list adds 'localhost' (scripts/test.sh): a listed name that resolves to loopback.
  it('a stored endpoint that points at loopback is not sent to; only our short reason is kept', async () => {
    // As if registered before these rules: put straight into the database.
    const code = await createTestAirfield({ 18: 180, 36: 360 })
    expect((await safety.put(`/api/limits/airfields/${code}`, { values: { maxCrosswindKt: 10 }, reason: 'Test field: low crosswind limit' })).status).toBe(200)
    const pilot = await newUser(admin, 'pilot', 'ssrf')
    expect((await pilot.client.put(`/api/subscriptions/${code}`, { email: false, push: true })).status).toBe(200)
    for (const endpoint of [targetUrl(), 'https://localhost/push/x']) {
      await db.query('INSERT INTO push_subscriptions (user_id, endpoint, p256dh, auth, label) VALUES (?, ?, ?, ?, ?)', [pilot.id, endpoint, keys.p256dh, keys.auth, 'legacy'])
    }
    // Wind 220° at 30 kt on runway 18: crosswind 19.3 kt (FAA crosswind chart example), over the 10 kt limit.
    expect((await dispatcher.post(`/api/airfields/${code}/profiles`, windProfile(220, 30))).status).toBe(201)
    // One delivery per crossing and device; every one fails at once, before any connection.
    const rows = await waitFor('the push deliveries to fail', async () => {
      const [r] = await db.query(`SELECT o.state, o.last_error AS lastError, s.endpoint FROM outbox o JOIN push_subscriptions s ON s.id = o.push_subscription_id
        WHERE s.user_id = ? AND o.channel = 'push'`, [pilot.id]) as unknown as [{ state: string, lastError: string | null, endpoint: string }[]]
      return r.length >= 2 && r.every(x => x.state === 'failed') ? r : null
    })
    expect(new Set(rows.map(r => r.endpoint)).size).toBe(2)
    expect(rows.find(r => r.endpoint.startsWith('https://localhost'))!.lastError).toContain('resolves to a loopback address (127.0.0.1)')
    expect(rows.find(r => r.endpoint.startsWith('http://127.0.0.1'))!.lastError).toContain('must be an https: URL')
    for (const r of rows) {
      expect(r.lastError).toMatch(/^not sent: /)
      expect(r.lastError).not.toContain(SECRET_REPLY)
    }
    expect(hits).toBe(0)
  })
})

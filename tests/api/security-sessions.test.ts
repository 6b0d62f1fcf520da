// Sessions that end (issue "Safe to deploy", point 2): a stored session per sign-in, checked on every request.
// Expected statuses follow RFC 9110 (401 for a request without valid credentials) and the cookie attributes
// RFC 6265 §4.1.2 (Max-Age / Expires); the limits are Veerline's documented defaults (README, Security).
import mysql from 'mysql2/promise'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, signedIn } from '../support/api'
import { mailTo, waitFor } from '../support/alerts'
import { startSecondInstance } from '../support/instance'

let admin: ApiClient
let db: mysql.Connection
beforeAll(async () => {
  admin = await signedIn('admin')
  db = await mysql.createConnection({ uri: process.env.DATABASE_URL!, timezone: 'Z' })
})
afterAll(async () => {
  await db?.end()
})

const PASSWORD = 'a-session-test-password'
async function freshUser(role = 'pilot') {
  const email = `session-${Date.now()}-${Math.floor(Math.random() * 1e6)}@veerline.example`
  const res = await admin.post('/api/users', { email, name: 'Session Test', role, password: PASSWORD })
  expect(res.status).toBe(201)
  return { email, id: res.body.user.id as number }
}
async function signIn(email: string, password = PASSWORD) {
  const c = new ApiClient()
  await c.signIn(email, password)
  return c
}
/** A second client holding a copy of the first one's cookie: what a stolen or kept cookie would be. */
function copyOf(c: ApiClient) {
  const copy = new ApiClient()
  copy.cookie = c.cookie
  return copy
}

describe('a session ends on the server, not only in the browser', () => {
  it('the cookie of a signed-out session no longer works', async () => {
    const { email } = await freshUser()
    const c = await signIn(email)
    const kept = copyOf(c)
    expect((await kept.get('/api/session')).status).toBe(200)
    expect((await c.delete('/api/session')).status).toBe(204)
    const after = await kept.get('/api/session')
    expect(after.status).toBe(401)
    expect(after.body.statusMessage).toMatch(/sign in again/i)
    // nuxt-auth-utils' own session read (what pages use) agrees.
    expect((await copyOf(kept).get('/api/_auth/session')).status).toBe(401)
  })

  it('signing out through the module\'s own route ends the stored session too', async () => {
    const { email } = await freshUser()
    const c = await signIn(email)
    const kept = copyOf(c)
    expect((await c.delete('/api/_auth/session')).status).toBe(200)
    expect((await kept.get('/api/session')).status).toBe(401)
  })

  it('"sign out everywhere" ends every session of the account and no other account\'s', async () => {
    const { email } = await freshUser()
    const laptop = await signIn(email)
    const phone = await signIn(email)
    const other = await signedIn('safety')
    expect((await phone.get('/api/session')).status).toBe(200)
    expect((await laptop.delete('/api/session/all')).status).toBe(204)
    expect((await phone.get('/api/session')).status).toBe(401)
    expect((await copyOf(laptop).get('/api/session')).status).toBe(401)
    expect((await other.get('/api/session')).status).toBe(200)
  })

  it('a password reset ends the sessions signed in with the old password', async () => {
    const { email } = await freshUser()
    const before = await signIn(email)
    expect((await new ApiClient().post('/api/password-resets', { email })).status).toBe(202)
    const mail = await waitFor('the reset e-mail', async () => (await mailTo(admin, email)).find(m => /\/reset\/[A-Za-z0-9_-]{43}/.test(m.text)))
    const token = mail.text.match(/\/reset\/([A-Za-z0-9_-]{43})/)![1]!
    const person = new ApiClient()
    expect((await person.post('/api/password-resets/confirm', { token, password: 'the-new-password-1' })).status).toBe(200)
    expect((await before.get('/api/session')).status).toBe(401)
    // The session the reset made holds.
    expect((await person.get('/api/session')).status).toBe(200)
  })

  it('a role change or a disabled account ends the person\'s sessions on their next request', async () => {
    const a = await freshUser('dispatcher')
    const ca = await signIn(a.email)
    expect((await admin.patch(`/api/users/${a.id}`, { role: 'pilot' })).status).toBe(200)
    expect((await ca.get('/api/session')).status).toBe(401)
    const again = await signIn(a.email)
    expect((await again.get('/api/session')).body.user.role).toBe('pilot')
    // A name change alone keeps the session.
    expect((await admin.patch(`/api/users/${a.id}`, { name: 'Renamed' })).status).toBe(200)
    expect((await again.get('/api/session')).status).toBe(200)

    const b = await freshUser()
    const cb = await signIn(b.email)
    expect((await admin.patch(`/api/users/${b.id}`, { disabled: true })).status).toBe(200)
    expect((await copyOf(cb).get('/api/session')).status).toBe(401)
    expect((await new ApiClient().post('/api/session', { email: b.email, password: PASSWORD })).status).toBe(401)
  })

  it('an idle session and one past its absolute limit end (their times moved back in the database)', async () => {
    const { email, id } = await freshUser()
    const idle = await signIn(email)
    // Default idle limit 12 h (README, Security): 13 h without use ends it.
    await db.query('UPDATE user_sessions SET last_seen_at = NOW(3) - INTERVAL 13 HOUR WHERE user_id = ?', [id])
    const res = await idle.get('/api/session')
    expect(res.status).toBe(401)
    expect(res.body.statusMessage).toMatch(/without use/)

    const old = await signIn(email)
    await db.query('UPDATE user_sessions SET expires_at = NOW(3) - INTERVAL 1 MINUTE WHERE user_id = ?', [id])
    const res2 = await old.get('/api/session')
    expect(res2.status).toBe(401)
    expect(res2.body.statusMessage).toMatch(/time limit/)
  })

  it('the session cookie expires: HttpOnly, SameSite=Lax and a Max-Age of the 12 h idle limit', async () => {
    const { email } = await freshUser()
    const res = await new ApiClient().post('/api/session', { email, password: PASSWORD })
    expect(res.status).toBe(200)
    const cookie = res.headers.getSetCookie().find(c => c.startsWith('nuxt-session=') && !c.startsWith('nuxt-session=;'))!
    expect(cookie).toMatch(/HttpOnly/i)
    expect(cookie).toMatch(/SameSite=Lax/i)
    expect(cookie).toMatch(/Max-Age=43200\b/)
    expect(cookie).toMatch(/Expires=/i)
  })

  it('only a SHA-256 of the session id is stored, one row per sign-in', async () => {
    const { email, id } = await freshUser()
    await signIn(email)
    await signIn(email)
    const [rows] = await db.query('SELECT id_hash AS idHash FROM user_sessions WHERE user_id = ?', [id]) as unknown as [{ idHash: string }[]]
    expect(rows).toHaveLength(2)
    for (const r of rows) expect(r.idHash).toMatch(/^[0-9a-f]{64}$/)
  })
})

describe('sessions across instances: nothing kept that could outlive a change', () => {
  it('a disable or a sign-out made on a second instance ends the session on the first at its very next request', async () => {
    const second = await startSecondInstance('admin@veerline.example')
    try {
      const a = await freshUser()
      const ca = await signIn(a.email)
      // Warm this instance: the same session asked many times at once, as a busy page does.
      const warm = await Promise.all(Array.from({ length: 20 }, () => ca.get('/api/session')))
      expect(warm.every(r => r.status === 200)).toBe(true)
      expect((await second.client.patch(`/api/users/${a.id}`, { disabled: true })).status).toBe(200)
      // No time to live to wait out: the first request after the change is refused, and every one with it.
      const after = await Promise.all(Array.from({ length: 20 }, () => copyOf(ca).get('/api/session')))
      expect(after.map(r => r.status)).toEqual(Array.from({ length: 20 }, () => 401))

      const b = await freshUser()
      const cb = await signIn(b.email)
      const onSecond = new ApiClient(second.client.baseUrl)
      onSecond.cookie = cb.cookie
      expect((await cb.get('/api/briefings')).status).toBe(200)
      expect((await onSecond.delete('/api/session')).status).toBeLessThan(300)
      expect((await copyOf(cb).get('/api/briefings')).status).toBe(401)
    }
    finally {
      await second.stop()
    }
  })
})

// Invitations and password resets: the e-mail path, single-use expiring tokens stored only as hashes.
import { createHash } from 'node:crypto'
import mysql from 'mysql2/promise'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, signedIn } from '../support/api'
import { mailTo, waitFor } from '../support/alerts'

let admin: ApiClient
let db: mysql.Connection
beforeAll(async () => {
  admin = await signedIn('admin')
  db = await mysql.createConnection({ uri: process.env.DATABASE_URL!, timezone: 'Z' })
})
afterAll(async () => {
  await db?.end()
})

const linkIn = (text: string, path: 'invite' | 'reset') => {
  const m = text.match(new RegExp(`/${path}/([A-Za-z0-9_-]{43})`))
  return m ? m[1]! : null
}
async function resetAudits(email: string, onlySent = false) {
  const [rows] = await db.query(`SELECT COUNT(*) AS n FROM audit_log WHERE action = 'user.request-reset'
    AND entity_id = (SELECT id FROM users WHERE email = ?)${onlySent ? ' AND JSON_EXTRACT(details, \'$.linkSent\') = true' : ''}`, [email])
  return Number((rows as { n: number }[])[0]!.n)
}

async function tokenRows(email: string) {
  const [rows] = await db.query('SELECT t.token_hash AS hash, t.used_at AS usedAt, t.purpose FROM user_tokens t JOIN users u ON u.id = t.user_id WHERE u.email = ? ORDER BY t.id', [email])
  return rows as { hash: string, usedAt: Date | null, purpose: string }[]
}

describe('invitations', () => {
  it('an admin invites by e-mail; the link sets a password once; the token is stored only as its SHA-256', async () => {
    const email = `invited-${Date.now()}@veerline.example`
    expect((await new ApiClient().post('/api/invitations', { email, name: 'X', role: 'pilot' })).status).toBe(401)
    expect((await (await signedIn('dispatcher')).post('/api/invitations', { email, name: 'X', role: 'pilot' })).status).toBe(403)

    const sent = await admin.post('/api/invitations', { email, name: 'Invited Pilot', role: 'pilot' })
    expect(sent.status).toBe(201)
    const mail = await waitFor('the invitation e-mail', async () => (await mailTo(admin, email)).find(m => linkIn(m.text, 'invite')))
    const token = linkIn(mail.text, 'invite')!
    const rows = await tokenRows(email)
    expect(rows).toHaveLength(1)
    expect(rows[0]!.hash).toBe(createHash('sha256').update(token).digest('hex'))
    expect(rows[0]!.hash).not.toContain(token)

    const peek = await new ApiClient().get(`/api/invitations/${token}`)
    expect(peek.status).toBe(200)
    expect(peek.body.email).toBe(email)
    const person = new ApiClient()
    const accepted = await person.post('/api/invitations/accept', { token, password: 'a-good-new-password' })
    expect(accepted.status).toBe(200)
    expect((await person.get('/api/session')).body.user).toMatchObject({ email, role: 'pilot' })
    // single use
    const again = await new ApiClient().post('/api/invitations/accept', { token, password: 'another-password-1' })
    expect(again.status).toBe(410)
    await new ApiClient().signIn(email, 'a-good-new-password')
  })

  it('an expired invitation is refused with 410 and a message to ask for a new one', async () => {
    const email = `expired-${Date.now()}@veerline.example`
    await admin.post('/api/invitations', { email, name: 'Late Reader', role: 'dispatcher' })
    const mail = await waitFor('the invitation e-mail', async () => (await mailTo(admin, email)).find(m => linkIn(m.text, 'invite')))
    const token = linkIn(mail.text, 'invite')!
    await db.query('UPDATE user_tokens t JOIN users u ON u.id = t.user_id SET t.expires_at = NOW() - INTERVAL 1 MINUTE WHERE u.email = ?', [email])
    const res = await new ApiClient().post('/api/invitations/accept', { token, password: 'a-good-new-password' })
    expect(res.status).toBe(410)
    expect(res.body.statusMessage).toMatch(/ask for a new one/)
  })
})

describe('password resets', () => {
  it('the same answer for a known and an unknown address; the link resets once; at most 3 links per 15 minutes', async () => {
    const email = `resetter-${Date.now()}@veerline.example`
    expect((await admin.post('/api/users', { email, name: 'Forgetful Pilot', role: 'pilot', password: 'the-old-password' })).status).toBe(201)
    const known = await new ApiClient().post('/api/password-resets', { email })
    const unknown = await new ApiClient().post('/api/password-resets', { email: `nobody-${Date.now()}@veerline.example` })
    expect(known.status).toBe(202)
    expect(unknown.status).toBe(202)
    expect(known.body).toEqual(unknown.body)

    const mail = await waitFor('the reset e-mail', async () => (await mailTo(admin, email)).find(m => linkIn(m.text, 'reset')))
    const token = linkIn(mail.text, 'reset')!
    const person = new ApiClient()
    expect((await person.post('/api/password-resets/confirm', { token, password: 'the-new-password' })).status).toBe(200)
    expect((await new ApiClient().post('/api/session', { email, password: 'the-old-password' })).status).toBe(401)
    await new ApiClient().signIn(email, 'the-new-password')
    expect((await new ApiClient().post('/api/password-resets/confirm', { token, password: 'yet-another-pass' })).status).toBe(410)

    // two more requests make three links in the window; the fourth and fifth answer the same but issue nothing.
    // The work runs after the answer, so wait until the audit shows all five requests handled.
    for (let i = 0; i < 4; i++) expect((await new ApiClient().post('/api/password-resets', { email })).status).toBe(202)
    await expect.poll(() => resetAudits(email), { timeout: 15_000 }).toBe(5)
    expect((await tokenRows(email)).filter(r => r.purpose === 'password-reset')).toHaveLength(3)
    expect(await resetAudits(email, true)).toBe(3)
  })
})

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

describe('pending invitations: list, resend, revoke', () => {
  async function invite(tag: string) {
    const email = `${tag}-${Date.now()}@veerline.example`
    expect((await admin.post('/api/invitations', { email, name: `Pending ${tag}`, role: 'safety' })).status).toBe(201)
    const mail = await waitFor('the invitation e-mail', async () => (await mailTo(admin, email)).find(m => linkIn(m.text, 'invite')))
    const pending = (await admin.get('/api/invitations')).body.invitations.find((i: { email: string }) => i.email === email)
    return { email, token: linkIn(mail.text, 'invite')!, pending }
  }
  async function audits(action: string, email: string) {
    const [rows] = await db.query('SELECT COUNT(*) AS n FROM audit_log WHERE action = ? AND entity_id = (SELECT id FROM users WHERE email = ?)', [action, email])
    return Number((rows as { n: number }[])[0]!.n)
  }

  it('GET /api/invitations lists who is waiting (admin only), with role, inviter, sent and expiry times', async () => {
    expect((await new ApiClient().get('/api/invitations')).status).toBe(401)
    expect((await (await signedIn('safety')).get('/api/invitations')).status).toBe(403)
    const { pending } = await invite('listed')
    expect(pending).toMatchObject({ role: 'safety', expired: false, invitedBy: { email: 'admin@veerline.example' } })
    // Invitations last 72 h (README, Accounts); the list says so.
    expect(Date.parse(pending.expiresAt) - Date.parse(pending.sentAt)).toBeGreaterThan(71.9 * 3600_000)
    expect(Date.parse(pending.expiresAt) - Date.parse(pending.sentAt)).toBeLessThanOrEqual(72 * 3600_000 + 1000)
  })

  it('resend sends a new link and voids the old one: the old token answers 410, the new one works', async () => {
    const { email, token: oldToken, pending } = await invite('resent')
    expect((await (await signedIn('dispatcher')).post(`/api/users/${pending.userId}/invitation`, {})).status).toBe(403)
    const res = await admin.post(`/api/users/${pending.userId}/invitation`, {})
    expect(res.status).toBe(200)
    expect(res.body.user.email).toBe(email)
    const newToken = await waitFor('the second invitation e-mail', async () => {
      const t = (await mailTo(admin, email)).map(m => linkIn(m.text, 'invite')).find(t => t && t !== oldToken)
      return t ?? null
    })
    expect((await new ApiClient().get(`/api/invitations/${oldToken}`)).status).toBe(410)
    expect((await new ApiClient().post('/api/invitations/accept', { token: oldToken, password: 'a-good-new-password' })).status).toBe(410)
    expect((await new ApiClient().get(`/api/invitations/${newToken}`)).status).toBe(200)
    expect(await audits('invitation.resend', email)).toBe(1)
    // Still one pending entry, now the newer link's.
    const listed = (await admin.get('/api/invitations')).body.invitations.filter((i: { email: string }) => i.email === email)
    expect(listed).toHaveLength(1)
    expect(Date.parse(listed[0].sentAt)).toBeGreaterThanOrEqual(Date.parse(pending.sentAt))
    const person = new ApiClient()
    expect((await person.post('/api/invitations/accept', { token: newToken, password: 'a-good-new-password' })).status).toBe(200)
    // Accepted: no longer pending, and nothing left to resend.
    expect((await admin.get('/api/invitations')).body.invitations.some((i: { email: string }) => i.email === email)).toBe(false)
    expect((await admin.post(`/api/users/${pending.userId}/invitation`, {})).status).toBe(404)
  })

  it('revoke makes the link answer 410 and leaves the account disabled; inviting again works', async () => {
    const { email, token, pending } = await invite('revoked')
    const res = await admin.delete(`/api/users/${pending.userId}/invitation`)
    expect(res.status).toBe(200)
    expect(res.body.revoked).toBe(true)
    expect((await new ApiClient().get(`/api/invitations/${token}`)).status).toBe(410)
    const accept = await new ApiClient().post('/api/invitations/accept', { token, password: 'a-good-new-password' })
    expect(accept.status).toBe(410)
    expect(accept.body.statusMessage).toMatch(/ask for a new one/)
    expect(await audits('invitation.revoke', email)).toBe(1)
    expect((await admin.get('/api/invitations')).body.invitations.some((i: { email: string }) => i.email === email)).toBe(false)
    expect((await admin.get('/api/users')).body.users.find((u: { email: string }) => u.email === email)).toMatchObject({ disabled: true, hasPassword: false })
    // A second revoke has nothing to withdraw; a bad id is a 422, never a 5xx.
    expect((await admin.delete(`/api/users/${pending.userId}/invitation`)).status).toBe(404)
    expect((await admin.delete('/api/users/not-a-number/invitation')).status).toBe(422)
    // Inviting the same address again enables the account with a fresh link.
    expect((await admin.post('/api/invitations', { email, name: 'Pending again', role: 'pilot' })).status).toBe(201)
    expect((await admin.get('/api/users')).body.users.find((u: { email: string }) => u.email === email)).toMatchObject({ disabled: false })
  })

  it('a link never issued answers 404 (a voided one 410, above)', async () => {
    expect((await new ApiClient().get(`/api/invitations/${'A'.repeat(43)}`)).status).toBe(404)
    expect((await new ApiClient().get('/api/invitations/short')).status).toBe(404)
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

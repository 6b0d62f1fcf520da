// The "Why" list of the issue "Safe to deploy", point 6 and 7: each input that answered 500 (or was read wrongly)
// now answers 4xx with the error contract, and nothing is half-saved. References beside each case.
import { afterAll, describe, expect, it } from 'vitest'
import { ApiClient, BASE_URL, signedIn } from '../support/api'
import { closeDb, countRows, makeAirfield, profileBody } from '../support/airfields'
import { mailTo, waitFor } from '../support/alerts'

afterAll(closeDb)

const headerQuery = () => {
  const b = profileBody(0, 3)
  return `validFrom=${encodeURIComponent(b.validFrom)}&validTo=${encodeURIComponent(b.validTo)}&source=radiosonde&heightReference=AGL`
}

describe('inputs that used to answer 500', () => {
  it('a 254-character e-mail (RFC 5321 §4.5.3.1.3 path limit 256 with the brackets) signs in, audits and signs out', async () => {
    const admin = await signedIn('admin')
    const local = 'l'.repeat(64) // RFC 5321 §4.5.3.1.1: a local part has at most 64 octets
    const domain = `${'d'.repeat(60)}.${'e'.repeat(60)}.${'f'.repeat(60)}.example`
    const email = `${local}@${domain}`.slice(0, 254)
    expect(email.length).toBe(254)
    const made = await admin.post('/api/users', { email, name: 'Long Address', role: 'dispatcher', password: 'a-long-address-pass' })
    expect(made.status).toBe(201)
    const c = new ApiClient()
    const res = await c.post('/api/session', { email, password: 'a-long-address-pass' })
    expect(res.status).toBe(200)
    // A token with a 120-character name (the longest the API takes) audits too.
    const token = await c.post('/api/tokens', { name: 'n'.repeat(120) })
    expect(token.status).toBe(201)
    expect((await c.delete('/api/session')).status).toBe(204)
  })

  it('page=1e300 and other non-decimal or huge page numbers are 422 on list routes', async () => {
    const admin = await signedIn('admin')
    for (const page of ['1e300', '1e3', '0x10', '-1', '0', '1.5', '100001', '9007199254740993']) {
      for (const path of [`/api/airfields/XVAL/profiles?page=${page}`, `/api/audit?page=${page}`]) {
        const res = await admin.get(path)
        expect(res.status, `${path}`).toBe(422)
      }
    }
    expect((await admin.get('/api/airfields/XVAL/profiles?page=100000')).status).toBe(200)
  })

  it('impossible offsets and dates are 422 (offsets -12:00 to +14:00, IANA tz database; real calendar days)', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    const before = await countRows('profiles')
    const cases: [string, string][] = [
      ['2026-03-01T06:00:00+99:99', '2026-03-01T08:00:00Z'],
      ['2026-03-01T06:00:00+2400', '2026-03-01T08:00:00Z'],
      ['2026-02-30T06:00:00Z', '2026-03-01T08:00:00Z'],
      ['10000-01-01T00:00:00Z', '10000-01-01T02:00:00Z'],
      ['0000-01-01T00:00:00Z', '0000-01-01T02:00:00Z'],
      ['9999-12-31T20:00:00Z', '9999-12-31T22:00:00Z'],
      ['1969-12-31T22:00:00Z', '1969-12-31T23:00:00Z'],
    ]
    for (const [validFrom, validTo] of cases) {
      const res = await dispatcher.post(`/api/airfields/${code}/profiles`, { ...profileBody(0, 2), validFrom, validTo })
      expect(res.status, validFrom).toBe(422)
      expect(res.body.data.issues.some((i: { field: string }) => i.field === 'validFrom'), validFrom).toBe(true)
    }
    for (const from of ['2026-03-01T06:00:00+99:99', '2026-02-30T00:00:00Z', '10000-01-01T00:00:00Z']) {
      expect((await dispatcher.get(`/api/airfields/${code}/profiles?from=${encodeURIComponent(from)}`)).status, from).toBe(422)
    }
    // A real offset still works: +05:45 (Nepal) and -03:30 (Newfoundland) are in use.
    const ok = await dispatcher.post(`/api/airfields/${code}/profiles`, { ...profileBody(0, 2), validFrom: '2026-03-01T11:45:00+05:45', validTo: '2026-03-01T04:30:00-03:30' })
    expect(ok.status, JSON.stringify(ok.body)).toBe(201)
    expect(await countRows('profiles')).toBe(before + 1)
  })

  it('trend?date=2026-02-30 is 422, not 2 March', async () => {
    const pilot = await signedIn('pilot')
    const res = await pilot.get('/api/airfields/XVAL/trend?date=2026-02-30')
    expect(res.status).toBe(422)
    expect((await pilot.get('/api/airfields/XVAL/trend?date=2028-02-29')).status).toBe(200) // 2028 is a leap year
  })

  it('a malformed airfield code in the path is 422 with the field named, not a 400 with a raw dump', async () => {
    const pilot = await signedIn('pilot')
    const res = await pilot.get('/api/airfields/X1')
    expect(res.status).toBe(422)
    expect(res.body.data.issues[0].field).toBe('code')
    expect(res.body.statusMessage).not.toMatch(/Validation Error/)
  })

  it('/api/profiles/0x1b is 422, not profile 27', async () => {
    const pilot = await signedIn('pilot')
    for (const id of ['0x1b', '1e1', '27abc', '-27', ' 27', '99999999999']) {
      const res = await pilot.get(`/api/profiles/${encodeURIComponent(id)}`)
      // Refused as input through the one contract: 422 with the field named.
      expect(res.status, id).toBe(422)
      expect(res.body.data.issues.length, id).toBeGreaterThan(0)
      expect(res.body.profile, id).toBeUndefined()
    }
  })

  it('a coded WS999/360999KT is refused: coded speeds have the 250 kt bound of filed ones', async () => {
    const dispatcher = await signedIn('dispatcher')
    // Group shape from the NWS TAF guidance: WShhh/dddffKT, e.g. WS020/27035KT.
    const res = await dispatcher.post('/api/wind/coded', { text: 'TAF XVAL 011100Z 0112/0218 22010KT 9999 WS999/360999KT' })
    expect(res.status).toBe(422)
    expect(JSON.stringify(res.body.data.issues)).toContain('above 250 kt')
    const metar = await dispatcher.post('/api/wind/coded', { text: 'METAR XVAL 011200Z 270260KT 9999' })
    expect(metar.status).toBe(422)
    const fine = await dispatcher.post('/api/wind/coded', { text: 'TAF XVAL 011100Z 0112/0218 22010KT 9999 WS020/27035KT' })
    expect(fine.status).toBe(200)
  })

  it('CSV headers __proto__ and constructor are unknown columns', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    for (const bad of ['__proto__', 'constructor', 'hasOwnProperty']) {
      const csv = `height_m,direction_deg,speed_kt,${bad}\n10,180,5,1\n300,190,10,1\n`
      const res = await dispatcher.post(`/api/airfields/${code}/profiles/import?format=csv&mode=preview&${headerQuery()}`, csv, { 'content-type': 'text/csv' })
      expect(res.status).toBe(200)
      expect(res.body.issues[0]).toMatchObject({ field: 'header' })
      // Header names are read in lower case.
      expect(res.body.issues[0].message).toContain(`unknown column "${bad.toLowerCase()}"`)
    }
  })

  it('/sign-in?next=//evil.example/x while signed in stays on our site', async () => {
    const pilot = await signedIn('pilot')
    for (const next of ['//evil.example/x', '/\\evil.example/x', 'https://evil.example/']) {
      const res = await fetch(new URL(`/sign-in?next=${encodeURIComponent(next)}`, BASE_URL), { headers: { cookie: pilot.cookie }, redirect: 'manual' })
      expect(res.status, next).toBeLessThan(500)
      const location = res.headers.get('location')
      if (location) expect(new URL(location, BASE_URL).origin, next).toBe(new URL(BASE_URL).origin)
    }
  })
})

describe('the smaller points', () => {
  it('the import route honours Idempotency-Key; the query is part of the request', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    const csv = 'height_m,direction_deg,speed_kt\n10,180,5\n300,190,10\n'
    const key = `imp-${Date.now()}`
    const path = `/api/airfields/${code}/profiles/import?format=csv&mode=file&${headerQuery()}`
    const first = await dispatcher.post(path, csv, { 'content-type': 'text/csv', 'idempotency-key': key })
    expect(first.status).toBe(201)
    const before = await countRows('profiles')
    const again = await dispatcher.post(path, csv, { 'content-type': 'text/csv', 'idempotency-key': key })
    expect(again.status).toBe(201)
    expect(again.headers.get('idempotent-replayed')).toBe('true')
    expect(again.body.profile.id).toBe(first.body.profile.id)
    expect(await countRows('profiles')).toBe(before)
    // The same key with another query (another source) is another request: refused, nothing filed.
    const other = await dispatcher.post(path.replace('source=radiosonde', 'source=estimate'), csv, { 'content-type': 'text/csv', 'idempotency-key': key })
    expect(other.status).toBe(422)
    expect(await countRows('profiles')).toBe(before)
  })

  it('the mailbox masks reset and invitation links unless an admin reveals them', async () => {
    const admin = await signedIn('admin')
    const email = `masked-${Date.now()}@veerline.example`
    expect((await admin.post('/api/invitations', { email, name: 'Masked Person', role: 'pilot' })).status).toBe(201)
    const revealed = await waitFor('the invitation', async () => (await mailTo(admin, email)).find(m => /\/invite\/[A-Za-z0-9_-]{43}/.test(m.text)))
    expect(revealed).toBeTruthy()
    const masked = await admin.get(`/api/mailbox?to=${encodeURIComponent(email)}`)
    expect(masked.body.revealed).toBe(false)
    expect(masked.body.messages[0].text).not.toMatch(/\/invite\/[A-Za-z0-9_-]{43}/)
    expect(masked.body.messages[0].text).toContain('/invite/(link hidden')
    // Revealing (as mailTo does, ?reveal=1) is recorded.
    const audit = await admin.get('/api/audit?action=mailbox.reveal-links')
    expect(audit.status).toBe(200)
    expect(audit.body.entries.length).toBeGreaterThan(0)
  })

  it('a repeated invitation answers what it stored', async () => {
    const admin = await signedIn('admin')
    const email = `again-${Date.now()}@veerline.example`
    expect((await admin.post('/api/invitations', { email, name: 'First Name', role: 'pilot' })).status).toBe(201)
    const second = await admin.post('/api/invitations', { email, name: 'Second Name', role: 'safety' })
    expect(second.status).toBe(201)
    const users = (await admin.get('/api/users')).body.users as { email: string, name: string, role: string }[]
    const stored = users.find(u => u.email === email)!
    expect(second.body.user).toMatchObject({ name: stored.name, role: stored.role })
  })
})

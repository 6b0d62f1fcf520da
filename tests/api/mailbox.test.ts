// The mailbox stand-in: newest first, paged on the server, searched by a part of the recipient's address.
import { beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, signedIn } from '../support/api'
import { waitFor } from '../support/alerts'

let admin: ApiClient
beforeAll(async () => {
  admin = await signedIn('admin')
})

describe('GET /api/mailbox paging and search', () => {
  it('pages newest first without overlap, and finds messages by a part of the recipient', async () => {
    expect((await new ApiClient().get('/api/mailbox?page=1')).status).toBe(401)
    expect((await (await signedIn('pilot')).get('/api/mailbox?page=1')).status).toBe(403)
    const tag = `mbx${Date.now()}`
    const emails = [1, 2, 3].map(i => `${tag}-${i}@veerline.example`)
    for (const email of emails) expect((await admin.post('/api/invitations', { email, name: 'Mailbox Reader', role: 'pilot' })).status).toBe(201)
    await waitFor('three invitation e-mails', async () => (await admin.get(`/api/mailbox?q=${tag}`)).body.total === 3)

    const first = await admin.get(`/api/mailbox?q=${tag.toUpperCase()}&page=1&pageSize=2`)
    expect(first.status).toBe(200)
    expect(first.body).toMatchObject({ total: 3, page: 1, pageSize: 2, pages: 2 })
    expect(first.body.messages).toHaveLength(2)
    const second = await admin.get(`/api/mailbox?q=${tag}&page=2&pageSize=2`)
    expect(second.body.messages).toHaveLength(1)
    const all = [...first.body.messages, ...second.body.messages]
    // Every message once, each to one of the three addresses, newest first (ISO 8601 times sort as text).
    expect(new Set(all.map(m => m.id)).size).toBe(3)
    expect(all.map(m => m.to).sort()).toEqual(emails.map(e => expect.stringContaining(e)))
    const times = all.map(m => m.receivedAt)
    expect([...times].sort().reverse()).toEqual(times)
    // A page past the end is empty, not an error; the exact-recipient filter still answers one address.
    expect((await admin.get(`/api/mailbox?q=${tag}&page=9&pageSize=2`)).body.messages).toHaveLength(0)
    expect((await admin.get(`/api/mailbox?to=${encodeURIComponent(emails[1]!)}`)).body.total).toBe(1)
  })

  it('refuses a bad page or page size with a 422 that names the field', async () => {
    for (const [q, field] of [['page=0', 'page'], ['pageSize=0', 'pageSize'], ['pageSize=500', 'pageSize'], ['page=abc', 'page']] as const) {
      const res = await admin.get(`/api/mailbox?${q}`)
      expect(res.status, q).toBe(422)
      expect(res.body.data.issues.map((i: { field: string }) => i.field), q).toContain(field)
    }
  })
})

// The airfield list and the briefing (home) list, one page at a time: search on code or name, paging with the total,
// the reader's followed airfields first, and clear refusals of a bad query.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { signedIn, type ApiClient } from '../support/api'
import { closeDb, makeAirfield, profileBody } from '../support/airfields'

afterAll(closeDb)

type Line = { code: string, name: string, followed?: boolean }
const codesOf = (body: { airfields: Line[] }) => body.airfields.map(a => a.code)

describe('paged airfield lists', () => {
  // Three airfields whose names carry a tag no other airfield has: every search below finds exactly these.
  const tag = `Pg${Math.random().toString(36).slice(2, 8)}`
  let codes: string[] = []
  let pilot: ApiClient
  beforeAll(async () => {
    const dispatcher = await signedIn('dispatcher')
    for (let i = 0; i < 3; i++) {
      const { code } = await makeAirfield(dispatcher, { name: `${tag} field ${i}` })
      codes.push(code)
    }
    codes = codes.sort()
    const filed = await dispatcher.post(`/api/airfields/${codes[2]}/profiles`, profileBody(0, 3))
    expect(filed.status).toBe(201)
    pilot = await signedIn('pilot')
  })
  afterAll(async () => {
    await pilot?.delete(`/api/subscriptions/${codes[2]}`)
  })

  it('pages the airfield list in code order with the total, without overlap, and past the end gives none with the total', async () => {
    const one = await pilot.get(`/api/airfields?q=${tag}&pageSize=2`)
    expect(one.status).toBe(200)
    expect(one.body).toMatchObject({ total: 3, page: 1, pageSize: 2, q: tag })
    const two = await pilot.get(`/api/airfields?q=${tag}&pageSize=2&page=2`)
    expect([...codesOf(one.body), ...codesOf(two.body)]).toEqual(codes)
    const past = await pilot.get(`/api/airfields?q=${tag}&pageSize=2&page=3`)
    expect(past.status).toBe(200)
    expect(past.body.airfields).toEqual([])
    expect(past.body.total).toBe(3)
    // The airfield with a profile says so on the list.
    const withProfile = two.body.airfields.find((a: Line) => a.code === codes[2])
    expect(withProfile.profileState.state).toBe('current')
  })

  it('finds by a part of the code or of the name, in any case; wildcards are taken as text', async () => {
    const byCode = await pilot.get(`/api/airfields?q=${codes[0]!.toLowerCase()}`)
    expect(codesOf(byCode.body)).toEqual([codes[0]])
    const byName = await pilot.get(`/api/briefings?q=${encodeURIComponent(`${tag.toUpperCase()} FIELD 1`)}`)
    expect(byName.status).toBe(200)
    expect(byName.body.airfields.map((a: Line) => a.name)).toEqual([`${tag} field 1`])
    expect(byName.body.caution).toMatch(/advisory/i)
    // '%' and '_' are SQL LIKE wildcards (ISO/IEC 9075); a search for them finds only names that contain them.
    for (const q of ['%', '_', `${tag}%`]) {
      const res = await pilot.get(`/api/airfields?q=${encodeURIComponent(q)}`)
      expect(res.status, q).toBe(200)
      expect(res.body.airfields.every((a: Line) => a.name.includes(q) || a.code.includes(q)), q).toBe(true)
    }
  })

  it('puts the reader\'s followed airfields first on the briefing list, marked, and can show only them', async () => {
    const before = await pilot.get(`/api/briefings?q=${tag}`)
    expect(codesOf(before.body)).toEqual(codes)
    expect(before.body.airfields.every((a: Line) => a.followed === false)).toBe(true)
    expect((await pilot.put(`/api/subscriptions/${codes[2]}`, { email: false, push: false })).status).toBe(200)
    const after = await pilot.get(`/api/briefings?q=${tag}`)
    expect(codesOf(after.body)).toEqual([codes[2], codes[0], codes[1]])
    expect(after.body.airfields[0].followed).toBe(true)
    expect(after.body.airfields[0].profile.status).toBe('current')
    const only = await pilot.get(`/api/briefings?q=${tag}&followed=1`)
    expect(codesOf(only.body)).toEqual([codes[2]])
    expect(only.body).toMatchObject({ total: 1, followedOnly: true })
    // Another reader's order is their own.
    const dispatcher = await signedIn('dispatcher')
    expect(codesOf((await dispatcher.get(`/api/briefings?q=${tag}`)).body)).toEqual(codes)
  })

  it('refuses a bad page, page size, filter or search with the field named, never a 5xx', async () => {
    const cases: [string, string][] = [
      ['page=0', 'page'], ['page=abc', 'page'], ['pageSize=101', 'pageSize'], ['pageSize=-1', 'pageSize'],
      ['followed=yes', 'followed'], [`q=${'x'.repeat(61)}`, 'q'], ['q=%00', 'q'],
    ]
    // Twice over, between good queries: a checked query is kept by its text (server/utils/api-handler.ts), and a
    // refusal must never be kept as, or turn into, an answer.
    for (let pass = 0; pass < 2; pass++) {
      for (const path of ['/api/airfields', '/api/briefings']) {
        for (const [query, field] of cases) {
          const res = await pilot.get(`${path}?${query}`)
          expect(res.status, `${path}?${query}`).toBe(422)
          expect(res.body.data.issues[0].field, `${path}?${query}`).toBe(field)
          const good = await pilot.get(`${path}?q=${tag}&pageSize=2&page=2`)
          expect(good.status, path).toBe(200)
          expect(good.body).toMatchObject({ page: 2, pageSize: 2, q: tag, total: 3 })
        }
      }
    }
  })
})

// Briefings from the analysis cache: trade precision at the boundary, thinned display levels, ETag/304, and never
// a stale briefing after an edit made on another instance.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, DEMO, signedIn } from '../support/api'
import { closeDb, makeAirfield, profileBody, runSql } from '../support/airfields'
import { startSecondInstance, type SecondInstance } from '../support/instance'

afterAll(closeDb)

/** Every number in a field named by its unit, with the decimals it may carry at trade precision. */
function decimalsOf(x: number) {
  const s = String(x)
  return s.includes('e') ? 99 : (s.split('.')[1] ?? '').length
}
function collect(v: unknown, key: string, out: { key: string, value: number }[] = []) {
  if (typeof v === 'number') out.push({ key, value: v })
  else if (Array.isArray(v)) v.forEach(x => collect(x, key, out))
  else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) collect(x, k, out)
  return out
}

describe('briefing answer at trade precision', () => {
  it('rounds wind to 0.1 kt, heights to 0.1 m and shear to 0.01 kt/100 ft, and agrees with the full answer', async () => {
    const pilot = await signedIn('pilot')
    const trade = (await pilot.get('/api/airfields/XCST/briefing')).body.briefing
    const full = (await pilot.get('/api/airfields/XCST/briefing?precision=full')).body.briefing
    expect(trade.profile.id).toBe(full.profile.id)
    // The steps are the ones named in server/domain/briefings/precision.ts (common practice: one decimal more than
    // reports carry, METAR wind in whole knots and heights in whole feet, WMO Manual on Codes FM 15).
    for (const { key, value } of collect(trade, '')) {
      if (/KtPer100ft$|MpsPer30m$/.test(key)) expect(decimalsOf(value), key).toBeLessThanOrEqual(2)
      else if (/(Kt|Mps|AglM|baseM|topM)$/.test(key)) expect(decimalsOf(value), key).toBeLessThanOrEqual(1)
    }
    for (const [i, end] of full.runwayEnds.entries()) {
      const t = trade.runwayEnds[i]
      expect(t.designator).toBe(end.designator)
      expect(t.surface.headwindKt).toBeCloseTo(end.surface.headwindKt, 1)
      expect(Math.abs(t.surface.headwindKt - end.surface.headwindKt)).toBeLessThanOrEqual(0.05 + 1e-9)
      expect(Math.abs(t.surface.crosswindKt - end.surface.crosswindKt)).toBeLessThanOrEqual(0.05 + 1e-9)
    }
    expect(Math.abs(trade.shear.strongestLayer.shearKtPer100ft - full.shear.strongestLayer.shearKtPer100ft)).toBeLessThanOrEqual(0.005 + 1e-9)
    // The few demo levels are all shown; the filed levels themselves are one link away, not repeated.
    expect(trade.levels).toHaveLength(full.levels.length)
    expect(trade.display).toMatchObject({ levelsShown: full.levels.length, levelCount: full.levels.length, note: null })
    expect(trade.input.levels).toBeUndefined()
    expect(trade.input.levelsUrl).toBe(`/api/profiles/${full.profile.id}`)
    expect(trade.caution).toContain('Advisory only')
  })

  it('shows at most 120 of 5,000 filed levels, the lowest and highest among them, in under 300 KB', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    const levels = Array.from({ length: 5000 }, (_, i) => ({ heightM: 10 + i * 2, directionDeg: 200 + (i % 50), speedKt: 10 + (i % 30) }))
    const filed = await dispatcher.post(`/api/airfields/${code}/profiles`, profileBody(0, 3, { levels }))
    expect(filed.status).toBe(201)
    const res = await dispatcher.get(`/api/airfields/${code}/briefing`)
    expect(res.status).toBe(200)
    const b = res.body.briefing
    expect(b.display.levelCount).toBe(5000)
    expect(b.levels.length).toBeLessThanOrEqual(120)
    expect(b.levels[0].heightAglM).toBe(10)
    expect(b.levels.at(-1).heightAglM).toBe(10 + 4999 * 2)
    expect(b.runwayEnds[0].levels).toHaveLength(b.levels.length)
    // The grid keeps its 30 m steps (0 to 600 m: 21) and the shown levels; each end's components follow it.
    expect(b.grid.length).toBeLessThanOrEqual(21 + b.levels.length + 2)
    expect(b.grid.filter((g: { heightAglM: number }) => g.heightAglM % 30 === 0).length).toBe(20) // 30 … 600 m (the lowest level is at 10 m)
    expect(b.runwayEnds[0].byHeight).toHaveLength(b.grid.length)
    expect(b.display.note).toContain('of 5000 levels shown')
    expect(JSON.stringify(res.body).length).toBeLessThan(300 * 1024)
  })
})

describe('ETag on briefings', () => {
  it('answers 304 to the same reader while nothing changed, and a new tag once they mark it read', async () => {
    const dispatcher = await signedIn('dispatcher')
    const pilot = await signedIn('pilot')
    const { code } = await makeAirfield(dispatcher)
    expect((await dispatcher.post(`/api/airfields/${code}/profiles`, profileBody(0, 3))).status).toBe(201)
    const first = await pilot.get(`/api/airfields/${code}/briefing`)
    const tag = first.headers.get('etag')
    expect(tag).toMatch(/^W\/".+"$/)
    const again = await pilot.get(`/api/airfields/${code}/briefing`, { 'if-none-match': tag! })
    expect(again.status).toBe(304)
    expect(again.body).toBeNull()
    expect((await pilot.post('/api/receipts', { profileId: first.body.briefing.profile.id })).status).toBe(201)
    const read = await pilot.get(`/api/airfields/${code}/briefing`, { 'if-none-match': tag! })
    expect(read.status).toBe(200)
    expect(read.body.receipt.profileId).toBe(first.body.briefing.profile.id)
    expect(read.headers.get('etag')).not.toBe(tag)
  })
})

describe('the cache never serves a stale briefing after an edit on another instance', () => {
  let second: SecondInstance
  let viaSecond: ApiClient
  beforeAll(async () => {
    second = await startSecondInstance('admin@veerline.example')
    viaSecond = second.client
  })
  afterAll(() => second?.stop())

  async function fieldWithProfile() {
    const dispatcher = await signedIn('dispatcher')
    const { code, airfield } = await makeAirfield(dispatcher)
    const filed = await dispatcher.post(`/api/airfields/${code}/profiles`, profileBody(0, 3))
    expect(filed.status).toBe(201)
    return { code, airfield, profileId: filed.body.profile.id as number, pilot: await signedIn('pilot') }
  }
  const end = (b: any, d: string) => b.runwayEnds.find((e: { designator: string }) => e.designator === d)

  it('a runway heading edited on the second instance shows in the next briefing on the first', async () => {
    const { code, pilot } = await fieldWithProfile()
    const before = (await pilot.get(`/api/airfields/${code}/briefing`)).body.briefing
    expect(end(before, '18').trueHeadingDeg).toBe(180)
    // The page's own request (one end in detail) is kept under its own key: it must follow the edit too.
    const pageBefore = await pilot.get(`/api/airfields/${code}/briefing?end=18`)
    expect(pageBefore.body.briefing.runwayEnds[0].trueHeadingDeg).toBe(180)
    const detail = await viaSecond.get(`/api/airfields/${code}`)
    const runwayId = detail.body.airfield.runways[0].id
    const edit = await viaSecond.patch(`/api/airfields/${code}/runways/${runwayId}`, {
      lengthM: 2400, ends: [{ designator: '18', trueHeadingDeg: 175 }, { designator: '36', trueHeadingDeg: 355 }],
    })
    expect(edit.status).toBe(200)
    const after = (await pilot.get(`/api/airfields/${code}/briefing`)).body.briefing
    expect(end(after, '18').trueHeadingDeg).toBe(175)
    const pageAfter = await pilot.get(`/api/airfields/${code}/briefing?end=18`, { 'if-none-match': pageBefore.headers.get('etag')! })
    expect(pageAfter.status).toBe(200)
    expect(pageAfter.body.briefing.runwayEnds[0].trueHeadingDeg).toBe(175)
    // Surface wind 200° at 12 kt on a heading of 175°: headwind = 12·cos 25° (trade formula, as in briefing.test.ts).
    expect(end(after, '18').surface.headwindKt).toBeCloseTo(12 * Math.cos(25 * Math.PI / 180), 1)
  })

  it('a briefing marked read on the second instance shows as read in the next briefing on the first', async () => {
    const { code, profileId, pilot } = await fieldWithProfile()
    // Read twice: the second is answered from what the first kept (confirmed at the session's counters).
    for (let i = 0; i < 2; i++) expect((await pilot.get(`/api/airfields/${code}/briefing?end=best`)).body.receipt).toBeNull()
    const pilotThere = await signedIn('pilot', viaSecond.baseUrl)
    const marked = await pilotThere.post('/api/receipts', { profileId })
    expect(marked.status).toBe(201)
    const after = (await pilot.get(`/api/airfields/${code}/briefing?end=best`)).body
    expect(after.receipt).toMatchObject({ profileId, id: marked.body.receipt.id })
    // Another reader's receipts are theirs: the dispatcher's briefing still shows none.
    expect((await (await signedIn('dispatcher')).get(`/api/airfields/${code}/briefing?end=best`)).body.receipt).toBeNull()
  })

  it('a limit changed on the second instance shows in the next briefing on the first', async () => {
    const { code, pilot } = await fieldWithProfile()
    const before = (await pilot.get(`/api/airfields/${code}/briefing`)).body.briefing
    expect(before.limits.values.maxCrosswindKt).not.toBe(7)
    const change = await viaSecond.put(`/api/limits/airfields/${code}`, { values: { maxCrosswindKt: 7 }, reason: 'Cache test: a tight crosswind limit' })
    expect(change.status).toBeLessThan(300)
    const after = (await pilot.get(`/api/airfields/${code}/briefing`)).body.briefing
    expect(after.limits.values.maxCrosswindKt).toBe(7)
    expect(after.limits.source.maxCrosswindKt).toBe('airfield')
  })

  it('a limit changed on the second instance shows on the next home list on the first', async () => {
    const { code, pilot } = await fieldWithProfile()
    const line = async () => (await pilot.get(`/api/briefings?q=${code}`)).body.airfields.find((a: { code: string }) => a.code === code)
    const before = await line()
    expect(before.profile).not.toBeNull()
    // Surface wind 200° at 12 kt across runway 18/36: crosswind 12·sin 20° = 4.1 kt on both ends (trade formula,
    // FAA AC 00-54 / common practice), so a 3 kt crosswind limit is crossed on both.
    const change = await viaSecond.put(`/api/limits/airfields/${code}`, { values: { maxCrosswindKt: 3 }, reason: 'Cache test: a crosswind limit under the wind' })
    expect(change.status).toBeLessThan(300)
    const after = await line()
    expect(after.exceededCount).toBeGreaterThanOrEqual(before.exceededCount + 2)
    const list = (await pilot.get(`/api/airfields?q=${code}`)).body.airfields
    expect(list.map((a: { code: string }) => a.code)).toEqual([code])
  })

  it('a profile superseded on the second instance gives way to the new one on the first', async () => {
    const { code, profileId, pilot } = await fieldWithProfile()
    expect((await pilot.get(`/api/airfields/${code}/briefing`)).body.briefing.profile.id).toBe(profileId)
    const old = await pilot.get(`/api/airfields/${code}/briefing?profile=${profileId}`)
    expect(old.body.briefing.profile.status).toBe('current')
    const newer = await viaSecond.post(`/api/airfields/${code}/profiles`, profileBody(0, 3, { source: 'aircraft-reports' }))
    expect(newer.status).toBe(201)
    const now = (await pilot.get(`/api/airfields/${code}/briefing`)).body.briefing
    expect(now.profile.id).toBe(newer.body.profile.id)
    const was = await pilot.get(`/api/airfields/${code}/briefing?profile=${profileId}`, { 'if-none-match': old.headers.get('etag')! })
    expect(was.status).toBe(200)
    expect(was.body.briefing.profile.status).toBe('superseded')
    expect(was.body.briefing.profile.supersededById).toBe(newer.body.profile.id)
  })

  it('a profile withdrawn on the second instance is no longer briefed on the first', async () => {
    const { code, profileId, pilot } = await fieldWithProfile()
    expect((await pilot.get(`/api/airfields/${code}/briefing`)).body.briefing.profile.id).toBe(profileId)
    const w = await viaSecond.post(`/api/profiles/${profileId}/withdraw`, { reason: 'Cache test: sensor fault' })
    expect(w.status).toBe(200)
    const now = await pilot.get(`/api/airfields/${code}/briefing`)
    expect(now.status).toBe(200)
    expect(now.body.briefing).toBeNull()
    const asked = (await pilot.get(`/api/airfields/${code}/briefing?profile=${profileId}`)).body.briefing
    expect(asked.profile.status).toBe('withdrawn')
    expect(asked.profile.withdrawnReason).toBe('Cache test: sensor fault')
  })

  it('a kept page of either list shows an airfield added, followed or renamed on the second instance', async () => {
    // Three airfields whose names carry a tag no other airfield has: the searches below find only these and the
    // one added later; two to a page, so that one of them is always off the first page.
    const tag = `Kp${Math.random().toString(36).slice(2, 8)}`
    const dispatcher = await signedIn('dispatcher')
    const pilot = await signedIn('pilot')
    const pilotViaSecond = new ApiClient(`http://127.0.0.1:${process.env.VEERLINE_PORT_2}`)
    await pilotViaSecond.signIn(DEMO.pilot)
    const codes: string[] = []
    for (let i = 0; i < 3; i++) codes.push((await makeAirfield(dispatcher, { name: `${tag} field ${i}` })).code)
    const page = async (path: string, extra = '') => {
      const res = await pilot.get(`${path}?q=${tag}&pageSize=2${extra}`)
      expect(res.status, path).toBe(200)
      return { codes: res.body.airfields.map((a: { code: string }) => a.code) as string[], total: res.body.total as number, first: res.body.airfields[0] }
    }
    const lists = ['/api/airfields', '/api/briefings']
    let all = [...codes].sort()
    for (const path of lists) {
      await page(path)
      expect(await page(path), path).toEqual(expect.objectContaining({ codes: all.slice(0, 2), total: 3 }))
    }
    const added = await makeAirfield(viaSecond, { name: `${tag} field 3` })
    all = [...all, added.code].sort()
    for (const path of lists) expect(await page(path), path).toEqual(expect.objectContaining({ codes: all.slice(0, 2), total: 4 }))
    // The last in code order, followed by the pilot through the second instance, comes first on their home list.
    const last = all[3]!
    try {
      expect((await pilotViaSecond.put(`/api/subscriptions/${last}`, { email: false, push: false })).status).toBe(200)
      const home = await page('/api/briefings')
      expect(home.codes).toEqual([last, all[0]])
      expect(home.first.followed).toBe(true)
      expect(await page('/api/briefings', '&followed=1')).toEqual(expect.objectContaining({ codes: [last], total: 1 }))
      // The airfield list is the same for every reader: in code order.
      expect((await page('/api/airfields')).codes).toEqual(all.slice(0, 2))
      // Renamed on the second instance so that the search no longer finds it: gone from both lists, the count too.
      expect((await viaSecond.patch(`/api/airfields/${all[0]}`, { name: 'Cache test renamed field' })).status).toBe(200)
      const left = all.slice(1)
      expect(await page('/api/airfields')).toEqual(expect.objectContaining({ codes: left.slice(0, 2), total: 3 }))
      expect(await page('/api/briefings')).toEqual(expect.objectContaining({ codes: [last, left[0]], total: 3 }))
      // No longer followed (through the second instance): back in code order.
      expect((await pilotViaSecond.delete(`/api/subscriptions/${last}`)).status).toBeLessThan(300)
      expect(await page('/api/briefings')).toEqual(expect.objectContaining({ codes: left.slice(0, 2), total: 3 }))
    }
    finally {
      await pilot.delete(`/api/subscriptions/${last}`)
    }
  })
})

describe('kept answers follow the database and the clock', () => {
  async function fieldWithProfile() {
    const dispatcher = await signedIn('dispatcher')
    const { code, airfield } = await makeAirfield(dispatcher)
    const filed = await dispatcher.post(`/api/airfields/${code}/profiles`, profileBody(0, 3))
    expect(filed.status).toBe(201)
    return { code, airfieldId: airfield.id as number, profileId: filed.body.profile.id as number, pilot: await signedIn('pilot') }
  }

  it('a change written straight to the database, by no route of the app, shows in the next briefing and lists', async () => {
    const { code, airfieldId, pilot } = await fieldWithProfile()
    for (let i = 0; i < 2; i++) {
      expect((await pilot.get(`/api/airfields/${code}/briefing?end=18`)).body.briefing.runwayEnds[0].trueHeadingDeg).toBe(180)
      expect((await pilot.get(`/api/airfields?q=${code}`)).body.airfields[0].name).toBe(`Test field ${code}`)
      expect((await pilot.get(`/api/briefings?q=${code}`)).body.airfields[0].name).toBe(`Test field ${code}`)
    }
    await runSql('UPDATE runway_ends SET true_heading_deg = 170 WHERE airfield_id = ? AND designator = \'18\'', [airfieldId])
    await runSql('UPDATE airfields SET name = ? WHERE id = ?', [`Renamed ${code}`, airfieldId])
    const end18 = (await pilot.get(`/api/airfields/${code}/briefing?end=18`)).body.briefing.runwayEnds[0]
    expect(end18.trueHeadingDeg).toBe(170)
    // Surface wind 200° at 12 kt on a heading of 170°: headwind 12·cos 30° = 10.4 kt (trade formula, common practice).
    expect(end18.surface.headwindKt).toBeCloseTo(12 * Math.cos(30 * Math.PI / 180), 1)
    expect((await pilot.get(`/api/airfields?q=${code}`)).body.airfields[0].name).toBe(`Renamed ${code}`)
    expect((await pilot.get(`/api/briefings?q=${code}`)).body.airfields[0].name).toBe(`Renamed ${code}`)
  })

  it('a profile whose validity runs out is not shown in force past its end, with nothing written meanwhile', async () => {
    const { code, profileId, pilot } = await fieldWithProfile()
    await runSql('UPDATE profiles SET valid_to = DATE_ADD(UTC_TIMESTAMP(), INTERVAL 2 SECOND) WHERE id = ?', [profileId])
    const readAll = async () => ({
      briefing: (await pilot.get(`/api/airfields/${code}/briefing`)).body.briefing,
      home: (await pilot.get(`/api/briefings?q=${code}`)).body.airfields[0],
      list: (await pilot.get(`/api/airfields?q=${code}`)).body.airfields[0],
    })
    for (let i = 0; i < 2; i++) {
      const r = await readAll()
      expect(r.briefing.profile.status).toBe('current')
      expect(r.home.profile.status).toBe('current')
      expect(r.list.profileState.state).toBe('current')
    }
    await new Promise(resolve => setTimeout(resolve, 3000))
    const later = await readAll()
    expect(later.briefing.profile.id).toBe(profileId)
    expect(later.briefing.profile.status).not.toBe('current')
    expect(later.home.profile.status).not.toBe('current')
    expect(later.list.profileState.state).toBe('none')
  })
})

describe('the briefing as the page asks it: one runway end in detail', () => {
  it('?end= details that end only, ranks and judges every end, and falls back to the best-ranked end', async () => {
    const pilot = await signedIn('pilot')
    const all = (await pilot.get('/api/airfields/XCST/briefing')).body.briefing
    const designators = all.runwayEnds.map((e: { designator: string }) => e.designator)
    expect(designators.length).toBeGreaterThan(1)
    const pick = designators[designators.length - 1]
    const one = await pilot.get(`/api/airfields/XCST/briefing?end=${pick.toLowerCase()}`)
    expect(one.status).toBe(200)
    const b = one.body.briefing
    expect(b.runwayEnds).toHaveLength(1)
    // The detailed end is the same as in the full answer, figure for figure.
    expect(b.runwayEnds[0]).toEqual(all.runwayEnds.find((e: { designator: string }) => e.designator === pick))
    expect(b.ranking).toEqual(all.ranking)
    expect(b.verdict).toEqual(all.verdict)
    expect(b.feetSteps.every((s: { components: { designator: string }[] }) => s.components.length === 1 && s.components[0]!.designator === pick)).toBe(true)
    expect(b.keyHeights.ft.every((k: { components: { designator: string }[] }) => k.components.map(c => c.designator).join() === pick)).toBe(true)
    expect(b.feetSteps.map((s: { heightAglFt: number }) => s.heightAglFt)).toEqual(all.feetSteps.map((s: { heightAglFt: number }) => s.heightAglFt))
    expect(JSON.stringify(one.body).length).toBeLessThan(JSON.stringify({ briefing: all }).length)
    expect(one.body.caution).toContain('Advisory only')
    // An end this airfield lacks, or best: the best-ranked end (what the page shows when nothing else is asked).
    for (const q of ['best', '01']) {
      const fb = (await pilot.get(`/api/airfields/XCST/briefing?end=${q}`)).body.briefing
      expect(fb.runwayEnds.map((e: { designator: string }) => e.designator)).toEqual([all.ranking[0].designator])
    }
    const bad = await pilot.get('/api/airfields/XCST/briefing?end=runway-9')
    expect(bad.status).toBe(422)
    expect(bad.body.data.issues[0].field).toBe('end')
    expect(bad.body.statusMessage).toMatch(/designator such as 09 or 27L/)
  })
})

describe('compressed answers', () => {
  it('gzips a briefing and the lists for a client that accepts gzip, to the same JSON; not when q=0', async () => {
    const { gunzipSync } = await import('node:zlib')
    const pilot = await signedIn('pilot')
    for (const path of ['/api/airfields/XCST/briefing?end=best', '/api/briefings', '/api/airfields']) {
      const url = new URL(path, pilot.baseUrl)
      const zipped = await fetch(url, { headers: { 'cookie': pilot.cookie, 'accept-encoding': 'gzip' } })
      expect(zipped.status).toBe(200)
      expect(zipped.headers.get('content-encoding'), path).toBe('gzip')
      expect(zipped.headers.get('vary')).toMatch(/accept-encoding/i)
      // Node's fetch (undici) undoes the gzip itself; the raw bytes are checked with node:http below.
      const text = await zipped.text()
      const plain = await fetch(url, { headers: { 'cookie': pilot.cookie, 'accept-encoding': 'gzip;q=0, identity' } })
      expect(plain.headers.get('content-encoding')).toBeNull()
      const a = JSON.parse(text)
      const p = JSON.parse(await plain.text())
      // generatedAt and ages differ by the moment of each read; the rest is the same answer.
      if (a.briefing) {
        expect(a.briefing.runwayEnds).toEqual(p.briefing.runwayEnds)
        expect(a.briefing.profile.id).toBe(p.briefing.profile.id)
      }
      else expect(a.airfields.map((x: { code: string }) => x.code)).toEqual(p.airfields.map((x: { code: string }) => x.code))
    }
    // The bytes on the wire are a gzip member (RFC 1952: 1f 8b) that inflates to JSON.
    const http = await import('node:http')
    const raw: Buffer = await new Promise((resolve, reject) => {
      http.get(new URL('/api/airfields/XCST/briefing', pilot.baseUrl), { headers: { 'cookie': pilot.cookie, 'accept-encoding': 'gzip' } }, (res) => {
        const parts: Buffer[] = []
        res.on('data', (c: Buffer) => parts.push(c))
        res.on('end', () => resolve(Buffer.concat(parts)))
      }).on('error', reject)
    })
    expect([raw[0], raw[1]]).toEqual([0x1f, 0x8b])
    expect(JSON.parse(gunzipSync(raw).toString('utf8')).briefing.runwayEnds.length).toBeGreaterThan(1)
  })
})

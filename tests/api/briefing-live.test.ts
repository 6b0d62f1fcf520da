// The briefing at the point of use: status and ages at the chosen time, key heights at exact round values, the
// verdict, the change against the superseded profile, and the live event stream across two app instances.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, signedIn } from '../support/api'
import { closeDb, makeAirfield, profileBody } from '../support/airfields'
import { startSecondInstance, type SecondInstance } from '../support/instance'

afterAll(closeDb)

const FT = 0.3048 // international foot, exact (1959 agreement)
const rad = (d: number) => (d * Math.PI) / 180
// Wind components the meteorological way, u = -V sin(dir), v = -V cos(dir) (WMO convention; MetPy's
// wind_components gives u = v = +7.0711 m/s for 10 m/s from 225°, checked below).
const uv = (dir: number, v: number) => ({ u: -v * Math.sin(rad(dir)), v: -v * Math.cos(rad(dir)) })
const fromUv = (u: number, v: number) => ({ speed: Math.hypot(u, v), dir: ((Math.atan2(-u, -v) * 180) / Math.PI + 360) % 360 || 360 })
/** Linear in u and v between two filed levels: the interpolation the briefing promises (independent of the engine). */
function between(h: number, a: { h: number, dir: number, kt: number }, b: { h: number, dir: number, kt: number }) {
  const t = (h - a.h) / (b.h - a.h)
  const p = uv(a.dir, a.kt)
  const q = uv(b.dir, b.kt)
  return fromUv(p.u + t * (q.u - p.u), p.v + t * (q.v - p.v))
}
// Headwind = V·cos(θ), crosswind = V·sin(θ), θ = wind direction − runway heading (FAA crosswind chart: runway 18,
// wind 220° at 30 kt gives 22.98 kt head and 19.28 kt cross).
const head = (dir: number, kt: number, hdg: number) => kt * Math.cos(rad(dir - hdg))
const cross = (dir: number, kt: number, hdg: number) => kt * Math.sin(rad(dir - hdg))

// The levels of profileBody(): 10 m 200°/12 G22, 150 m 220°/25, 300 m 240°/35, 600 m 250°/40.
const L = [{ h: 10, dir: 200, kt: 12 }, { h: 150, dir: 220, kt: 25 }, { h: 300, dir: 240, kt: 35 }, { h: 600, dir: 250, kt: 40 }]

const CALM = [{ heightM: 10, directionDeg: 180, speedKt: 5 }, { heightM: 300, directionDeg: 185, speedKt: 8 }, { heightM: 600, directionDeg: 190, speedKt: 10 }]

let dispatcher: ApiClient
let pilot: ApiClient
beforeAll(async () => {
  dispatcher = await signedIn('dispatcher')
  pilot = await signedIn('pilot')
})

async function field() {
  const { code } = await makeAirfield(dispatcher)
  return code
}
async function file(code: string, body: Record<string, unknown>, client = dispatcher) {
  const res = await client.post(`/api/airfields/${code}/profiles`, body)
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body.profile.id as number
}

describe('the reference formulas of this file', () => {
  it('reproduce MetPy\'s wind_components example and the FAA crosswind chart example', () => {
    const w = uv(225, 10)
    expect(w.u).toBeCloseTo(7.0711, 4)
    expect(w.v).toBeCloseTo(7.0711, 4)
    expect(head(220, 30, 180)).toBeCloseTo(22.98, 2)
    expect(cross(220, 30, 180)).toBeCloseTo(19.28, 2)
  })
})

describe('status and ages at the chosen time', () => {
  it('a profile valid now is "valid at" a chosen hour inside it and "expired" at one past it; now it stays current', async () => {
    const code = await field()
    const id = await file(code, profileBody(-1, 3))
    const now = (await pilot.get(`/api/airfields/${code}/briefing`)).body.briefing
    expect(now.profile.id).toBe(id)
    expect(now.atChosen).toBe(false)
    expect(now.profile.status).toBe('current')
    expect(now.profile.statusWords).toBe('Current: valid now')
    const inside = new Date(Date.now() + 3600_000).toISOString()
    const a = (await pilot.get(`/api/airfields/${code}/briefing?at=${inside}`)).body.briefing
    expect(a.atChosen).toBe(true)
    expect(a.profile.status).toBe('current')
    expect(a.profile.statusWords).toBe(`Valid at ${inside.slice(0, 10)} ${inside.slice(11, 16)}Z`)
    const past = new Date(Date.now() + 4 * 3600_000).toISOString()
    const b = (await pilot.get(`/api/airfields/${code}/briefing?at=${past}`)).body.briefing
    expect(b.profile.id).toBe(id)
    expect(b.profile.status).toBe('expired')
    expect(b.profile.statusNow).toBe('current')
    const to = new Date(b.profile.validTo)
    expect(b.profile.statusWords).toBe(`Expired at ${past.slice(0, 10)} ${past.slice(11, 16)}Z: its validity ended ${to.toISOString().slice(0, 10)} ${to.toISOString().slice(11, 16)}Z`)
  })

  it('a later profile asked for at an earlier hour is "not yet valid" then', async () => {
    const code = await field()
    const id = await file(code, profileBody(2, 3))
    const at = new Date(Date.now() + 600_000).toISOString()
    const b = (await pilot.get(`/api/airfields/${code}/briefing?profile=${id}&at=${at}`)).body.briefing
    expect(b.profile.status).toBe('upcoming')
    expect(b.profile.statusWords).toMatch(/^Not yet valid at \d{4}-\d{2}-\d{2} \d{2}:\d{2}Z: it begins \d{4}-\d{2}-\d{2} \d{2}:\d{2}Z$/)
  })

  it('age counts from filing, not from the start of validity; stale past the setting at the chosen time', async () => {
    const code = await field()
    // Valid from two hours ago, filed just now: the old rule said "120 min old".
    await file(code, profileBody(-2, 5))
    const b = (await pilot.get(`/api/airfields/${code}/briefing`)).body.briefing
    expect(b.profile.filedMinutesAgo).toBeGreaterThanOrEqual(0)
    expect(b.profile.filedMinutesAgo).toBeLessThanOrEqual(1)
    expect(b.profile.observedAt).toBeNull()
    expect(b.profile.stale).toBe(false)
    expect(b.profile.staleWords).toBeNull()
    expect(b.profile.staleAfterMinutes).toBe(90) // shared/briefing/status.ts default (VEERLINE_STALE_AFTER_MIN unset in tests)
    const later = new Date(Date.now() + 2 * 3600_000).toISOString()
    const s = (await pilot.get(`/api/airfields/${code}/briefing?at=${later}`)).body.briefing
    expect(s.profile.ageAtChosenTimeMinutes).toBeGreaterThanOrEqual(119)
    expect(s.profile.stale).toBe(true)
    expect(s.profile.staleWords).toContain('Stale')
  })
})

describe('key heights at exact round values', () => {
  it('feet: SFC, 500, 1,000, 1,500 ft interpolated at 152.4, 304.8, 457.2 m; 2,000 ft (609.6 m) is past the profile', async () => {
    const code = await field()
    await file(code, profileBody(0, 3))
    const b = (await pilot.get(`/api/airfields/${code}/briefing?precision=full`)).body.briefing
    const rows = b.keyHeights.ft
    expect(rows.map((r: { label: string }) => r.label)).toEqual(['SFC', '500 ft', '1,000 ft', '1,500 ft', '2,000 ft'])
    expect(rows.map((r: { heightAglM: number }) => r.heightAglM)).toEqual([10, 500 * FT, 1000 * FT, 1500 * FT, 2000 * FT])
    // SFC is the surface level itself, with its gust.
    expect(rows[0].directionDeg).toBe(200)
    expect(rows[0].speedKt).toBe(12)
    expect(rows[0].gustKt).toBe(22)
    const sfc18 = rows[0].components.find((c: { designator: string }) => c.designator === '18')
    expect(sfc18.headwindKt).toBeCloseTo(head(200, 12, 180), 9)
    expect(sfc18.gustHeadwindKt).toBeCloseTo(head(200, 22, 180), 9)
    const expectAt = (row: any, a: typeof L[number], c: typeof L[number]) => {
      const w = between(row.heightAglM, a, c)
      expect(row.speedKt).toBeCloseTo(w.speed, 9)
      expect(row.directionDeg).toBeCloseTo(w.dir, 9)
      for (const [designator, hdg] of [['18', 180], ['36', 360]] as const) {
        const comp = row.components.find((x: { designator: string }) => x.designator === designator)
        expect(comp.headwindKt).toBeCloseTo(head(w.dir, w.speed, hdg), 9)
        expect(comp.crosswindKt).toBeCloseTo(cross(w.dir, w.speed, hdg), 9)
      }
    }
    expectAt(rows[1], L[1]!, L[2]!) // 152.4 m lies between the 150 m and 300 m levels
    expectAt(rows[2], L[2]!, L[3]!) // 304.8 m
    expectAt(rows[3], L[2]!, L[3]!) // 457.2 m
    expect(rows[4].speedKt).toBeNull()
    expect(rows[4].reason).toBe('the profile stops at 1,969 ft') // 600 m / 0.3048 = 1968.5 ft
  })

  it('metres: SFC, 150, 300, 450, 600 m; 150 and 300 m are the filed levels themselves', async () => {
    const code = await field()
    await file(code, profileBody(0, 3))
    const b = (await pilot.get(`/api/airfields/${code}/briefing`)).body.briefing
    const rows = b.keyHeights.m
    expect(rows.map((r: { label: string }) => r.label)).toEqual(['SFC', '150 m', '300 m', '450 m', '600 m'])
    expect(rows[1].directionDeg).toBe(220)
    expect(rows[1].speedKt).toBe(25)
    expect(rows[2].directionDeg).toBe(240)
    expect(rows[4].speedKt).toBe(40)
    const mid = between(450, L[2]!, L[3]!)
    // Trade precision: wind to 0.1 kt, directions to 0.1° (server/domain/briefings/precision.ts).
    expect(rows[3].speedKt).toBeCloseTo(mid.speed, 1)
    expect(rows[3].directionDeg).toBeCloseTo(mid.dir, 1)
  })
})

describe('the verdict', () => {
  it('names each end\'s exceeded limits, airfield-wide ones included, and says so plainly when no end is within limits', async () => {
    const code = await field()
    // 5 kt at the surface to 40 kt 30 m higher: about 35 kt per 100 ft, far over the 8 kt/100 ft default.
    await file(code, { ...profileBody(0, 3), levels: [
      { heightM: 10, directionDeg: 200, speedKt: 5 }, { heightM: 40, directionDeg: 200, speedKt: 40 },
      { heightM: 300, directionDeg: 210, speedKt: 42 }, { heightM: 600, directionDeg: 220, speedKt: 45 },
    ] })
    const b = (await pilot.get(`/api/airfields/${code}/briefing?precision=full`)).body.briefing
    expect(b.verdict.noEndWithinLimits).toBe(true)
    expect(b.verdict.banner).toContain('No runway end is within limits')
    for (const d of ['18', '36']) {
      const n = b.checks.filter((c: { designator: string | null, state: string }) => (c.designator === d || c.designator === null) && c.state === 'exceeded').length
      const v = b.verdict.ends.find((e: { designator: string }) => e.designator === d)
      expect(n).toBeGreaterThan(0)
      expect(v.exceededCount).toBe(n)
      expect(v.words).toBe(`Runway ${d}: ${n} ${n === 1 ? 'limit' : 'limits'} exceeded`)
    }
  })

  it('a calm profile: "Runway 18: within limits", no banner', async () => {
    const code = await field()
    await file(code, { ...profileBody(0, 3), levels: CALM })
    const b = (await pilot.get(`/api/airfields/${code}/briefing`)).body.briefing
    expect(b.verdict.noEndWithinLimits).toBe(false)
    expect(b.verdict.banner).toBeNull()
    expect(b.verdict.ends.find((e: { designator: string }) => e.designator === '18').words).toBe('Runway 18: within limits')
  })
})

describe('what changed against the superseded profile', () => {
  it('the newer briefing carries the older one\'s key figures and the differences, each equal to the older briefing', async () => {
    const code = await field()
    const first = await file(code, profileBody(0, 3))
    const secondBody = profileBody(0, 3, { levels: [
      { heightM: 10, directionDeg: 170, speedKt: 18 }, { heightM: 150, directionDeg: 200, speedKt: 30 },
      { heightM: 300, directionDeg: 230, speedKt: 38 }, { heightM: 600, directionDeg: 250, speedKt: 44 },
    ] })
    const second = await file(code, secondBody)
    const older = (await pilot.get(`/api/airfields/${code}/briefing?profile=${first}&precision=full`)).body.briefing
    const newer = (await pilot.get(`/api/airfields/${code}/briefing?precision=full`)).body.briefing
    expect(newer.profile.id).toBe(second)
    expect(older.profile.status).toBe('superseded')
    expect(older.change).toBeNull()
    const ch = newer.change
    expect(ch.previousProfileId).toBe(first)
    expect(ch.strongestShearBeforeKtPer100ft).toBeCloseTo(older.shear.strongestLayer.shearKtPer100ft, 9)
    expect(ch.strongestShearAfterKtPer100ft).toBeCloseTo(newer.shear.strongestLayer.shearKtPer100ft, 9)
    for (const e of ch.ends) {
      const o = older.runwayEnds.find((x: { designator: string }) => x.designator === e.designator)
      const n = newer.runwayEnds.find((x: { designator: string }) => x.designator === e.designator)
      expect(e.before.headwindKt).toBeCloseTo(o.surface.headwindKt, 9)
      expect(e.headwindChangeKt).toBeCloseTo(n.surface.headwindKt - o.surface.headwindKt, 9)
      expect(e.crosswindChangeKt).toBeCloseTo(n.surface.crosswindKt - o.surface.crosswindKt, 9)
      expect(e.arrivalLossChangeKt).toBeCloseTo(n.arrival.maxAirspeedLossKt - o.arrival.maxAirspeedLossKt, 9)
    }
    // Runway 18, surface: 200°/12 kt before, 170°/18 kt after (headwind = V·cos θ).
    const e18 = ch.ends.find((e: { designator: string }) => e.designator === '18')
    expect(e18.headwindChangeKt).toBeCloseTo(head(170, 18, 180) - head(200, 12, 180), 9)
  })
})

/** Reads a text/event-stream until `until` says stop or `ms` pass; returns the events seen. */
async function readEvents(res: Response, until: (events: { event: string, data: any, id: string | null }[]) => boolean, ms: number) {
  const events: { event: string, data: any, id: string | null }[] = []
  const reader = res.body!.getReader()
  const decoder = new TextDecoder()
  let buffer = ''
  const deadline = Date.now() + ms
  while (Date.now() < deadline && !until(events)) {
    const chunk = await Promise.race([reader.read(), new Promise<null>(r => setTimeout(() => r(null), Math.max(1, deadline - Date.now())))])
    if (!chunk || chunk.done) break
    buffer += decoder.decode(chunk.value, { stream: true })
    let cut: number
    while ((cut = buffer.indexOf('\n\n')) >= 0) {
      const block = buffer.slice(0, cut)
      buffer = buffer.slice(cut + 2)
      let event = 'message'
      let data = ''
      let id: string | null = null
      for (const line of block.split('\n')) {
        if (line.startsWith('event:')) event = line.slice(6).trim()
        else if (line.startsWith('data:')) data += line.slice(5).trim()
        else if (line.startsWith('id:')) id = line.slice(3).trim()
      }
      events.push({ event, data: data ? JSON.parse(data) : null, id })
    }
  }
  await reader.cancel().catch(() => {})
  return events
}

function openStream(client: ApiClient, code: string, headers: Record<string, string> = {}) {
  const ctl = new AbortController()
  const p = fetch(new URL(`/api/airfields/${code}/events`, client.baseUrl), {
    headers: { 'cookie': client.cookie, 'x-forwarded-for': client.address, 'accept': 'text/event-stream', ...headers }, signal: ctl.signal,
  })
  return { ctl, p }
}

describe('GET /api/airfields/{code}/events', () => {
  let second: SecondInstance
  let viaSecond: ApiClient
  beforeAll(async () => {
    second = await startSecondInstance('dispatch@veerline.example')
    viaSecond = second.client
  })
  afterAll(() => second?.stop())

  it('asks who is asking first (401), then the code (422, 404)', async () => {
    expect((await new ApiClient().get('/api/airfields/XVAL/events')).status).toBe(401)
    const bad = await pilot.get('/api/airfields/X1/events')
    expect(bad.status).toBe(422)
    expect(bad.body.data.issues[0].field).toBe('code')
    expect((await pilot.get('/api/airfields/XZZQ/events')).status).toBe(404)
  })

  it('a profile filed on the second instance reaches a stream open on the first within 5 s, with the alert count', async () => {
    const code = await field()
    // A calm profile first (within every default limit), then the pilot follows the airfield, so that the
    // exceeding profile filed below raises a new alert in their inbox.
    await file(code, { ...profileBody(0, 3), levels: CALM })
    expect((await pilot.put(`/api/subscriptions/${code}`, { email: false, push: false })).status).toBe(200)
    const { ctl, p } = openStream(pilot, code)
    const res = await p
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toContain('text/event-stream')
    const started = Date.now()
    const filing = (async () => {
      await new Promise(r => setTimeout(r, 300))
      // Strong shear near the ground: over the default limits, so an alert is raised for followers.
      return viaSecond.post(`/api/airfields/${code}/profiles`, { ...profileBody(0, 3), levels: [
        { heightM: 10, directionDeg: 200, speedKt: 5 }, { heightM: 40, directionDeg: 200, speedKt: 40 }, { heightM: 600, directionDeg: 220, speedKt: 45 },
      ] })
    })()
    const events = await readEvents(res, ev => ev.some(e => e.event === 'change') && ev.some(e => e.event === 'alerts'), 8000)
    ctl.abort()
    expect((await filing).status).toBe(201)
    expect(events[0]!.event).toBe('hello')
    expect(events[0]!.data.code).toBe(code)
    const change = events.find(e => e.event === 'change')
    expect(change, JSON.stringify(events)).toBeTruthy()
    expect(Date.now() - started).toBeLessThan(8000)
    expect(change!.data.kinds).toEqual(['filed', 'superseded'])
    expect(change!.id).not.toBe(events[0]!.id)
    const alerts = events.find(e => e.event === 'alerts')
    const count = (await pilot.get('/api/alerts/inbox/count')).body.unacknowledged
    expect(alerts!.data.alerts).toBe(count)
    expect(alerts!.data.alerts).toBeGreaterThan(events[0]!.data.alerts)
  })

  it('a reconnecting browser that missed a change (older Last-Event-ID) is told at once', async () => {
    const code = await field()
    await file(code, profileBody(0, 3))
    const first = openStream(pilot, code)
    const hello = await readEvents(await first.p, ev => ev.length > 0, 5000)
    first.ctl.abort()
    const id = hello[0]!.id!
    const w = await viaSecond.post(`/api/profiles/${(await pilot.get(`/api/airfields/${code}/briefing`)).body.briefing.profile.id}/withdraw`, { reason: 'Live test: sensor fault' })
    expect(w.status).toBe(200)
    const again = openStream(pilot, code, { 'last-event-id': id })
    const events = await readEvents(await again.p, ev => ev.length >= 2, 5000)
    again.ctl.abort()
    expect(events.map(e => e.event)).toEqual(['hello', 'change'])
    expect(events[1]!.data.kinds).toEqual(['withdrawn'])
  })
})

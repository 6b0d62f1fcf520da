// The briefing route against the wind engine run directly on the same input, for every demo profile.
import { beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, demoDay, signedIn } from '../support/api'
import { analyseProfile, MPS_PER_KT } from '../../shared/wind'
import { DEFAULT_LIMITS, evaluateLimits } from '../../shared/limits'

const DEMO_CODES = ['XVAL', 'XCST', 'XHGH']
let pilot: ApiClient
let dispatcher: ApiClient

beforeAll(async () => {
  pilot = await signedIn('pilot')
  dispatcher = await signedIn('dispatcher')
})

async function demoProfileIds(code: string): Promise<number[]> {
  const res = await pilot.get(`/api/airfields/${code}/trend?date=${await demoDay(pilot)}`)
  expect(res.status).toBe(200)
  return res.body.points.map((p: { profileId: number }) => p.profileId)
}

describe('GET /api/airfields/{code}/briefing', () => {
  it('asks who is asking first: 401 signed out, before any validation', async () => {
    const res = await new ApiClient().get('/api/airfields/XVAL/briefing?at=nonsense')
    expect(res.status).toBe(401)
  })

  it('says what is wrong with the query, field by field', async () => {
    const bad = await pilot.get('/api/airfields/XVAL/briefing?at=yesterday')
    expect(bad.status).toBe(422)
    expect(bad.body.data.issues[0].field).toBe('at')
    const code = await pilot.get('/api/airfields/X1/briefing')
    expect(code.status).toBe(422)
    expect(code.body.data.issues[0].field).toBe('code')
    const missing = await pilot.get('/api/airfields/XZZQ/briefing')
    expect(missing.status).toBe(404)
    expect(missing.body.message).toContain('XZZQ')
  })

  for (const code of DEMO_CODES) {
    it(`${code}: every demo profile's briefing carries the engine's own figures and limit checks`, async () => {
      const ids = await demoProfileIds(code)
      expect(ids.length).toBe(8) // the demo files a profile every 3 hours of the day
      let exceededSeen = 0
      for (const id of ids) {
        const res = await pilot.get(`/api/airfields/${code}/briefing?profile=${id}&precision=full`)
        expect(res.status).toBe(200)
        const b = res.body.briefing
        expect(b.profile.id).toBe(id)
        expect(b.caution).toContain('Advisory only')
        const engine = analyseProfile(b.input)
        expect(b.levels).toEqual(engine.levels)
        expect(b.grid).toEqual(engine.grid)
        expect(b.shear).toEqual(engine.shear)
        expect(b.convective).toEqual(engine.convective)
        expect(b.runwayEnds.map((e: { designator: string }) => e.designator)).toEqual(engine.runwayEnds.map(e => e.designator))
        for (const [i, end] of engine.runwayEnds.entries()) {
          const got = b.runwayEnds[i]
          expect(got.surface).toEqual(end.surface)
          expect(got.byHeight).toEqual(end.byHeight)
          expect(got.arrival).toEqual(end.arrival)
          expect(got.departure).toEqual(end.departure)
        }
        // The demo sets no limits of its own: the briefing is held against the defaults.
        expect(b.limits.values).toEqual(DEFAULT_LIMITS)
        const checks = evaluateLimits(engine, DEFAULT_LIMITS)
        expect(b.checks).toEqual(checks)
        // Ranking: ends within their own limits first, most surface headwind first inside each group.
        const ranking = b.ranking as { designator: string, headwindKt: number | null, withinLimits: boolean, reasons: string[] }[]
        expect(ranking.map(r => r.designator).sort()).toEqual(engine.runwayEnds.map(e => e.designator).sort())
        const firstExceeded = ranking.findIndex(r => !r.withinLimits)
        if (firstExceeded >= 0) expect(ranking.slice(firstExceeded).every(r => !r.withinLimits)).toBe(true)
        for (let k = 1; k < ranking.length; k++) {
          if (ranking[k]!.withinLimits === ranking[k - 1]!.withinLimits && ranking[k]!.headwindKt != null) {
            expect(ranking[k - 1]!.headwindKt!).toBeGreaterThanOrEqual(ranking[k]!.headwindKt!)
          }
        }
        for (const r of ranking) {
          const own = checks.filter(c => c.designator === r.designator && c.state === 'exceeded')
          expect(r.withinLimits).toBe(own.length === 0)
          for (const c of own) expect(r.reasons).toContain(c.message)
          exceededSeen += own.length
        }
      }
      if (code !== 'XVAL') expect(exceededSeen).toBeGreaterThan(0)
    })
  }

  it('surface components follow headwind = V·cos θ, crosswind = V·sin θ (trade formula; 1 kt = 1852/3600 m/s exactly)', async () => {
    const res = await pilot.get('/api/airfields/XCST/briefing?precision=full')
    const b = res.body.briefing
    const surface = b.input.levels[0] // the lidar's lowest level, 30 ft, speed filed in m/s
    const speedKt = surface.speedMps / (1852 / 3600)
    expect(MPS_PER_KT).toBe(1852 / 3600)
    for (const end of b.runwayEnds) {
      const theta = (surface.directionDeg - end.trueHeadingDeg) * Math.PI / 180
      expect(end.surface.headwindKt).toBeCloseTo(speedKt * Math.cos(theta), 9)
      expect(end.surface.crosswindKt).toBeCloseTo(speedKt * Math.sin(theta), 9)
    }
  })

  it('picks the profile valid at ?at= and marks an earlier one expired', async () => {
    const now = await pilot.get('/api/airfields/XVAL/briefing')
    expect(now.status).toBe(200)
    const day = now.body.briefing.profile.validFrom.slice(0, 10)
    const at = `${day}T06:30:00Z`
    const res = await pilot.get(`/api/airfields/XVAL/briefing?at=${at}`)
    const p = res.body.briefing.profile
    expect(new Date(p.validFrom).getTime()).toBeLessThanOrEqual(new Date(at).getTime())
    expect(new Date(p.validTo).getTime()).toBeGreaterThanOrEqual(new Date(at).getTime())
    expect(p.validFrom).toBe(`${day}T06:00:00.000Z`)
    // Status at the chosen time (issue 12): valid at 06:30; where it stands now is statusNow.
    expect(p.status).toBe('current')
    if (new Date(p.validTo).getTime() < Date.now()) expect(p.statusNow).toBe('expired')
    expect(now.body.briefing.profile.status).toBe('current')
  })

  it('answers 404 for a profile of another airfield', async () => {
    const [otherId] = await demoProfileIds('XHGH')
    const res = await pilot.get(`/api/airfields/XVAL/briefing?profile=${otherId}`)
    expect(res.status).toBe(404)
    expect(res.body.message).toContain('XVAL')
  })

  it('gives components every 100 ft that agree with the 30 m grid at shared heights (0 ft = 0 m)', async () => {
    const b = (await pilot.get('/api/airfields/XHGH/briefing?precision=full')).body.briefing
    const steps = b.feetSteps as { heightAglFt: number, heightAglM: number, speedKt: number, directionDeg: number }[]
    expect(steps.length).toBeGreaterThan(10)
    for (const s of steps) expect(s.heightAglM).toBeCloseTo(s.heightAglFt * 0.3048, 9) // 1 ft = 0.3048 m exactly
    // Each step is linear in u, v between the grid points around it (u = -V·sin dir, v = -V·cos dir, WMO convention).
    const grid = b.grid as { heightAglM: number, uKt: number, vKt: number }[]
    expect(steps[0]!.heightAglM).toBeGreaterThanOrEqual(grid[0]!.heightAglM - 1e-9)
    for (const s of steps) {
      const j = Math.max(1, grid.findIndex(g => g.heightAglM >= s.heightAglM - 1e-9))
      const lo = grid[j - 1]!
      const hi = grid[j]!
      const t = (s.heightAglM - lo.heightAglM) / (hi.heightAglM - lo.heightAglM)
      const u = lo.uKt + t * (hi.uKt - lo.uKt)
      const v = lo.vKt + t * (hi.vKt - lo.vKt)
      const dir = s.directionDeg * Math.PI / 180
      expect(-s.speedKt * Math.sin(dir)).toBeCloseTo(u, 9)
      expect(-s.speedKt * Math.cos(dir)).toBeCloseTo(v, 9)
    }
  })
})

describe('GET /api/airfields/{code}/trend', () => {
  it('charts the day: strongest shear per profile equals the briefing, its limits are the effective ones', async () => {
    const res = await pilot.get(`/api/airfields/XHGH/trend?date=${await demoDay(pilot)}`)
    expect(res.status).toBe(200)
    expect(res.body.limits.maxLayerShearKtPer100ft).toBe(DEFAULT_LIMITS.maxLayerShearKtPer100ft)
    expect(res.body.limits.perEnd.map((p: { designator: string }) => p.designator)).toEqual(['11', '29'])
    for (const point of res.body.points.slice(0, 3)) {
      const b = (await pilot.get(`/api/airfields/XHGH/briefing?profile=${point.profileId}&precision=full`)).body.briefing
      expect(point.strongestShearKtPer100ft).toBe(b.shear.strongestLayer.shearKtPer100ft)
      const end = b.runwayEnds.find((e: { designator: string }) => e.designator === '11')
      const p11 = point.ends.find((e: { designator: string }) => e.designator === '11')
      expect(p11.crosswindKt).toBe(Math.abs(end.surface.crosswindKt))
      expect(p11.tailwindKt).toBe(Math.max(0, -end.surface.headwindKt))
    }
    const bad = await pilot.get('/api/airfields/XHGH/trend?date=2026-13-45')
    expect(bad.status).toBe(422)
    expect(bad.body.data.issues[0].field).toBe('date')
  })
})

describe('preferences', () => {
  it('starts at kt, ft, true; PUT changes part and keeps the rest; bad values are named', async () => {
    const safety = await signedIn('safety')
    expect((await new ApiClient().get('/api/preferences')).status).toBe(401)
    const first = await safety.get('/api/preferences')
    expect(first.body.preferences).toEqual({ speedUnit: 'kt', heightUnit: 'ft', headingRef: 'true' })
    const put = await safety.put('/api/preferences', { speedUnit: 'mps', headingRef: 'magnetic' })
    expect(put.status).toBe(200)
    expect(put.body.preferences).toEqual({ speedUnit: 'mps', heightUnit: 'ft', headingRef: 'magnetic' })
    expect((await safety.get('/api/preferences')).body.preferences.speedUnit).toBe('mps')
    const bad = await safety.put('/api/preferences', { speedUnit: 'furlongs' })
    expect(bad.status).toBe(422)
    expect(bad.body.data.issues[0].field).toBe('speedUnit')
    expect((await safety.put('/api/preferences', {})).status).toBe(422)
    await safety.put('/api/preferences', { speedUnit: 'kt', headingRef: 'true' })
  })
})

describe('read receipts', () => {
  it('a pilot marks a version read once; a dispatcher sees who read which version', async () => {
    const b = (await pilot.get('/api/airfields/XHGH/briefing')).body.briefing
    expect((await dispatcher.post('/api/receipts', { profileId: b.profile.id })).status).toBe(403)
    const bad = await pilot.post('/api/receipts', { profileId: 'x' })
    expect(bad.status).toBe(422)
    expect(bad.body.data.issues[0].field).toBe('profileId')
    expect((await pilot.post('/api/receipts', { profileId: 99999999 })).status).toBe(404)
    const first = await pilot.post('/api/receipts', { profileId: b.profile.id })
    expect(first.status).toBe(201)
    const again = await pilot.post('/api/receipts', { profileId: b.profile.id })
    expect(again.status).toBe(200)
    expect(again.body.receipt.readAt).toBe(first.body.receipt.readAt)
    const mine = (await pilot.get('/api/airfields/XHGH/briefing')).body.receipt
    expect(mine.profileId).toBe(b.profile.id)
    const list = await dispatcher.get('/api/receipts?airfield=XHGH')
    expect(list.status).toBe(200)
    const row = list.body.receipts.find((r: { profileId: number }) => r.profileId === b.profile.id)
    expect(row.user.email).toBe('pilot@veerline.example')
    expect(row.stale).toBe(false)
  })
})

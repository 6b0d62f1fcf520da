// Pure pieces of the briefing at the point of use: wind at a height, key heights, verdict, status words, ages.
import { describe, expect, it } from 'vitest'
import { windAtHeightAglM, analyseProfile } from '../../../shared/wind'
import { keyHeights, keyHeightLabel } from '../../../shared/briefing/key-heights'
import { airfieldVerdict, runwayVerdict } from '../../../shared/briefing/verdict'
import { ageWords, profileAges, profileStatusAt, statusWordsAt, utcMinute } from '../../../shared/briefing/status'
import { changeKinds } from '../../../shared/briefing/live'

const FT = 0.3048 // exact, 1959 international yard and pound agreement

describe('windAtHeightAglM', () => {
  // MetPy's wind_components example (DOMAIN.md): 10 m/s from 225° is u = v = +7.0711; the same here in kt.
  const a = analyseProfile({ heightReference: 'AGL', levels: [
    { heightM: 0, directionDeg: 225, speedKt: 10 }, { heightM: 100, directionDeg: 135, speedKt: 10 },
  ] })
  it('is linear in u and v: halfway between 225°/10 and 135°/10 is from 180° at 7.0711 kt', () => {
    // u: +7.0711 and −7.0711 average to 0; v: +7.0711 both → wind from the south at 7.0711 kt.
    const w = windAtHeightAglM(a.levels, 50)!
    expect(w.uKt).toBeCloseTo(0, 9)
    expect(w.vKt).toBeCloseTo(7.0711, 4)
    expect(w.directionDeg).toBeCloseTo(180, 9)
    expect(w.speedKt).toBeCloseTo(7.0711, 4)
    expect(w.filed).toBe(false)
  })
  it('gives a filed level unchanged and nothing outside the profile', () => {
    expect(windAtHeightAglM(a.levels, 100)).toMatchObject({ directionDeg: 135, speedKt: 10, filed: true })
    expect(windAtHeightAglM(a.levels, 100.5)).toBeNull()
    expect(windAtHeightAglM([], 0)).toBeNull()
  })
  it('agrees with the engine\'s own 30 m grid where both exist', () => {
    const p = analyseProfile({ heightReference: 'AGL', levels: [
      { heightM: 10, directionDeg: 200, speedKt: 12 }, { heightM: 150, directionDeg: 220, speedKt: 25 }, { heightM: 600, directionDeg: 250, speedKt: 40 },
    ] })
    for (const g of p.grid) {
      const w = windAtHeightAglM(p.levels, g.heightAglM)!
      expect(w.uKt).toBeCloseTo(g.uKt, 9)
      expect(w.vKt).toBeCloseTo(g.vKt, 9)
    }
  })
})

describe('keyHeights', () => {
  const p = analyseProfile({ heightReference: 'AGL', runwayEnds: [{ designator: '18', trueHeadingDeg: 180 }], levels: [
    { heightM: 10, directionDeg: 220, speedKt: 30, gustKt: 40 }, { heightM: 700, directionDeg: 220, speedKt: 30 },
  ] })
  it('labels round values in the reader\'s unit and takes them at exactly those heights', () => {
    const ft = keyHeights(p.levels, p.surface, [{ designator: '18', trueHeadingDeg: 180 }], 'ft')
    expect(ft.map(r => r.label)).toEqual(['SFC', '500 ft', '1,000 ft', '1,500 ft', '2,000 ft'])
    expect(ft.slice(1).map(r => r.heightAglM)).toEqual([500 * FT, 1000 * FT, 1500 * FT, 2000 * FT])
    const m = keyHeights(p.levels, p.surface, [{ designator: '18', trueHeadingDeg: 180 }], 'm')
    expect(m.map(r => r.heightAglM)).toEqual([10, 150, 300, 450, 600])
  })
  it('components follow the FAA crosswind chart example: runway 18, 220° at 30 kt → 22.98 kt head, 19.28 kt from the right', () => {
    const [sfc, h500] = keyHeights(p.levels, p.surface, [{ designator: '18', trueHeadingDeg: 180 }], 'ft')
    expect(sfc!.components[0]!.headwindKt).toBeCloseTo(22.98, 2)
    expect(sfc!.components[0]!.crosswindKt).toBeCloseTo(19.28, 2)
    expect(sfc!.gustKt).toBe(40)
    // Gust components scale the same way: 40 kt at 40° off the runway.
    expect(sfc!.components[0]!.gustHeadwindKt).toBeCloseTo(40 * Math.cos(40 * Math.PI / 180), 9)
    expect(h500!.components[0]!.crosswindKt).toBeCloseTo(19.28, 2)
  })
  it('without a surface level SFC says why', () => {
    const q = analyseProfile({ heightReference: 'AGL', levels: [{ heightM: 100, directionDeg: 90, speedKt: 10 }, { heightM: 300, directionDeg: 90, speedKt: 10 }] })
    const [sfc, h150] = keyHeights(q.levels, q.surface, [], 'm')
    expect(sfc!.speedKt).toBeNull()
    expect(sfc!.reason).toContain('no surface level')
    expect(h150!.speedKt).toBeCloseTo(10, 9)
    expect(keyHeightLabel(1500, 'ft')).toBe('1,500 ft')
  })
})

describe('verdict', () => {
  const checks = [
    { designator: '27', state: 'exceeded' as const, message: 'Tailwind 12 kt over 10 kt' },
    { designator: '27', state: 'near' as const, message: 'Crosswind near' },
    { designator: null, state: 'exceeded' as const, message: 'Layer shear over' },
    { designator: '09', state: 'within' as const, message: '' },
  ]
  it('counts the end\'s own and the airfield-wide exceedances', () => {
    expect(runwayVerdict('27', checks).words).toBe('Runway 27: 2 limits exceeded')
    expect(runwayVerdict('09', checks).words).toBe('Runway 09: 1 limit exceeded')
    expect(runwayVerdict('09', checks.filter(c => c.designator !== null)).words).toBe('Runway 09: within limits')
    expect(runwayVerdict('27', checks.filter(c => c.state !== 'exceeded')).words).toBe('Runway 27: within limits (1 near its limit)')
  })
  it('banner only when no end is within limits', () => {
    expect(airfieldVerdict(['09', '27'], checks).noEndWithinLimits).toBe(true)
    expect(airfieldVerdict(['09', '27'], checks.filter(c => c.designator !== null)).banner).toBeNull()
    expect(airfieldVerdict([], checks).noEndWithinLimits).toBe(false)
  })
})

describe('status and ages', () => {
  const p = { status: 'active', validFrom: new Date('2026-12-02T06:00:00Z'), validTo: new Date('2026-12-02T09:00:00Z') }
  it('status at the chosen time, words that name it', () => {
    const late = new Date('2026-12-02T10:00:00Z')
    expect(profileStatusAt(p, late)).toBe('expired')
    expect(statusWordsAt('expired', p, late, true)).toBe('Expired at 2026-12-02 10:00Z: its validity ended 2026-12-02 09:00Z')
    expect(statusWordsAt('current', p, new Date('2026-12-02T07:00:00Z'), true)).toBe('Valid at 2026-12-02 07:00Z')
    expect(statusWordsAt('current', p, new Date('2026-12-02T07:00:00Z'), false)).toBe('Current: valid now')
    expect(profileStatusAt({ ...p, status: 'withdrawn' }, new Date('2026-12-02T07:00:00Z'))).toBe('withdrawn')
    expect(utcMinute(new Date('2026-12-02T00:00:00Z'))).toBe('2026-12-02 00:00Z')
  })
  it('age from filing (or observation), stale past the setting at the chosen time', () => {
    const createdAt = new Date('2026-12-02T06:59:00Z')
    const now = new Date('2026-12-02T07:00:00Z')
    const a = profileAges({ createdAt }, now, now, 90)
    expect(a.filedMinutesAgo).toBe(1)
    expect(a.stale).toBe(false)
    const b = profileAges({ createdAt, observedAt: new Date('2026-12-02T05:00:00Z') }, now, now, 90)
    expect(b.ageAtChosenTimeMinutes).toBe(120)
    expect(b.stale).toBe(true)
    expect(b.staleWords).toContain('observation is 2 h 00 min old')
    expect(ageWords(45)).toBe('45 min')
    expect(ageWords(3 * 1440 + 240)).toBe('3 d 4 h')
  })
})

describe('changeKinds (event stream)', () => {
  it('tells filing, withdrawal, supersession and limit changes apart', () => {
    expect(changeKinds('1,5,0,0,0,0/abc', '2,6,0,1,0,9/abc')).toEqual(['filed', 'superseded'])
    expect(changeKinds('2,6,0,1,0,9/abc', '2,6,1,1,7,9/abc')).toEqual(['withdrawn'])
    expect(changeKinds('2,6,0,1,0,9/abc', '2,6,0,1,0,9/def')).toEqual(['limits'])
    expect(changeKinds('x/abc', 'x/abc')).toEqual([])
  })
})

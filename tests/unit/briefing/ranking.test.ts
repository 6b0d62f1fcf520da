import { describe, expect, it } from 'vitest'
import { profileStatus, rankRunwayEnds } from '../../../server/domain/briefings/briefing'
import { analyseProfile } from '../../../shared/wind'
import { DEFAULT_LIMITS, evaluateLimits } from '../../../shared/limits'

// A single runway 04/22 (true headings 47 and 227) with a surface wind from 220° at 12 kt, gusting 26:
// 22 has a 12·cos(7°) = 11.9 kt headwind; 04 the same as a tailwind (above the 10 kt default, NLR-TP-2001-003).
function analysed(dirDeg: number, speedKt: number, gustKt?: number) {
  return analyseProfile({
    heightReference: 'AGL',
    levels: [
      { heightM: 10, directionDeg: dirDeg, speedKt, ...(gustKt ? { gustKt } : {}) },
      { heightM: 300, directionDeg: dirDeg, speedKt: speedKt + 4 },
      { heightM: 600, directionDeg: dirDeg, speedKt: speedKt + 8 },
    ],
    runwayEnds: [{ designator: '04', trueHeadingDeg: 47 }, { designator: '22', trueHeadingDeg: 227 }],
  })
}

describe('rankRunwayEnds', () => {
  it('puts the headwind end first and the end over its tailwind limit last, with the reason', () => {
    const a = analysed(220, 12)
    const checks = evaluateLimits(a, DEFAULT_LIMITS)
    const ranking = rankRunwayEnds(a.runwayEnds, checks)
    expect(ranking.map(r => r.designator)).toEqual(['22', '04'])
    expect(ranking[0]!.headwindKt).toBeCloseTo(12 * Math.cos(7 * Math.PI / 180), 9) // V·cos θ
    expect(ranking[0]!.withinLimits).toBe(true)
    expect(ranking[1]!.withinLimits).toBe(false)
    expect(ranking[1]!.exceeded).toContain('tailwind')
    expect(ranking[1]!.reasons[0]).toMatch(/Tailwind runway 04 11\.9 kt exceeds the limit of 10 kt by 1\.9 kt/)
  })

  it('with every end within limits, ranks by headwind, then by the smaller crosswind', () => {
    const a = analysed(137, 8) // straight across: both ends about 0 headwind
    const ranking = rankRunwayEnds(a.runwayEnds, evaluateLimits(a, DEFAULT_LIMITS))
    expect(ranking.every(r => r.withinLimits)).toBe(true)
    const fake = [
      { designator: '09', surface: { heightAglM: 10, headwindKt: 5, crosswindKt: 9, crosswindSide: 'right' as const } },
      { designator: '27', surface: { heightAglM: 10, headwindKt: -5, crosswindKt: -9, crosswindSide: 'left' as const } },
      { designator: '14', surface: { heightAglM: 10, headwindKt: 5, crosswindKt: 3, crosswindSide: 'right' as const } },
      { designator: '32', surface: null },
    ]
    expect(rankRunwayEnds(fake, []).map(r => r.designator)).toEqual(['14', '09', '27', '32'])
  })

  it('a gust over the tailwind limit demotes the end even when the mean is within it (check the gust too: common practice)', () => {
    const a = analysed(40, 5, 20) // from 040: 04 has the headwind; 22 a 5 kt tailwind, gust tailwind ~19.9 kt
    const ranking = rankRunwayEnds(a.runwayEnds, evaluateLimits(a, DEFAULT_LIMITS))
    expect(ranking.map(r => r.designator)).toEqual(['04', '22'])
    expect(ranking[1]!.exceeded).toEqual(['tailwind-gust'])
  })
})

describe('profileStatus', () => {
  const base = { validFrom: new Date('2026-03-01T06:00:00Z'), validTo: new Date('2026-03-01T09:00:00Z') }
  it('marks withdrawn and superseded above validity, then expired, upcoming and current', () => {
    const at = new Date('2026-03-01T07:00:00Z')
    expect(profileStatus({ ...base, status: 'withdrawn' }, at)).toBe('withdrawn')
    expect(profileStatus({ ...base, status: 'superseded' }, at)).toBe('superseded')
    expect(profileStatus({ ...base, status: 'active' }, at)).toBe('current')
    expect(profileStatus({ ...base, status: 'active' }, new Date('2026-03-01T09:00:01Z'))).toBe('expired')
    expect(profileStatus({ ...base, status: 'active' }, new Date('2026-03-01T05:59:59Z'))).toBe('upcoming')
  })
})

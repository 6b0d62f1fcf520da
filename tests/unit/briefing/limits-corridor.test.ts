import { describe, expect, it } from 'vitest'
import { analyseProfile } from '../../../shared/wind'
import { DEFAULT_LIMITS, evaluateLimits } from '../../../shared/limits'

describe('airspeed loss limit on the 3 NM corridor (airport wind shear alerting practice, 15 kt after ICAO Annex 3)', () => {
  it('a steadily strengthening wind: 20 kt over 0-600 m, 9.7 kt within 3 NM on a 3° path: within the 15 kt limit', () => {
    // Runway 18, wind from 180° growing evenly from 0 at the ground to 20 kt at 600 m.
    const a = analyseProfile({
      heightReference: 'AGL',
      levels: [{ heightM: 0, directionDeg: 180, speedKt: 0 }, { heightM: 600, directionDeg: 180, speedKt: 20 }],
      runwayEnds: [{ designator: '18', trueHeadingDeg: 180 }],
    })
    const arrival = evaluateLimits(a, DEFAULT_LIMITS).find(c => c.kind === 'airspeed-loss-arrival')!
    // 3 NM = 5556 m; 5556 · tan 3° = 291.2 m; 20 kt · 291.2 / 600 = 9.71 kt.
    expect(arrival.value).toBeCloseTo(9.71, 2)
    expect(arrival.state).toBe('within')
    expect(arrival.message).toMatch(/within 3 NM of the threshold/)
    expect(a.runwayEnds[0]!.arrival!.maxAirspeedLossKt).toBeCloseTo(20, 9)
  })
})

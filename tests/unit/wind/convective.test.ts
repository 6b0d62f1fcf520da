import { describe, expect, it } from 'vitest'
import {
  BUNKERS_DEVIATION_MPS, MPS_PER_KT, WindValidationError, analyseProfile, bunkersStormMotion, stormRelativeHelicity,
  streamwiseVorticityShare,
} from '../../../shared/wind'
import type { LevelInput } from '../../../shared/wind'

describe('storm-relative helicity (Markowski and Richardson 2010, discrete form)', () => {
  it('heights 0/250/500/750 m, u 0/20/10/0, v 20/0/0/10 m/s, storm at rest: +400, -100, total 300 m²/s² (MetPy test suite case)', () => {
    const r = stormRelativeHelicity([0, 250, 500, 750], [0, 20, 10, 0], [20, 0, 0, 10], { topM: 750, stormUMps: 0, stormVMps: 0 })
    expect(r.positiveM2s2).toBeCloseTo(400, 9)
    expect(r.negativeM2s2).toBeCloseTo(-100, 9)
    expect(r.totalM2s2).toBeCloseTo(300, 9)
  })

  it('a storm moving with the mean of a straight hodograph sees no helicity (straight hodograph, no turning: Markowski and Richardson 2010)', () => {
    const r = stormRelativeHelicity([0, 1000, 3000], [0, 10, 30], [0, 0, 0], { topM: 3000, stormUMps: 15, stormVMps: 0 })
    expect(r.totalM2s2).toBeCloseTo(0, 9)
  })

  it('refuses a layer outside the data with its own error', () => {
    expect(() => stormRelativeHelicity([0, 500], [0, 1], [0, 1], { topM: 1000, stormUMps: 0, stormVMps: 0 })).toThrow(WindValidationError)
  })
})

describe('Bunkers et al. (2000) storm motion', () => {
  it('linear unidirectional shear u = z/600 m/s: mean (5, 0), right mover (5, -7.5), left (5, +7.5) m/s (worked by hand from the Bunkers 2000 definition)', () => {
    const h = [0, 500, 1000, 3000, 5500, 6000, 8000]
    const u = h.map(z => z / 600)
    const v = h.map(() => 0)
    const s = bunkersStormMotion(h, u, v)
    expect(s.meanUMps).toBeCloseTo(5, 9)
    expect(s.meanVMps).toBeCloseTo(0, 9)
    // shear from the 0-0.5 km mean (250/600) to the 5.5-6 km mean (5750/600)
    expect(s.shearUMps).toBeCloseTo(5500 / 600, 9)
    expect(s.rightUMps).toBeCloseTo(5, 9)
    expect(s.rightVMps).toBeCloseTo(-BUNKERS_DEVIATION_MPS, 9)
    expect(s.leftVMps).toBeCloseTo(BUNKERS_DEVIATION_MPS, 9)
  })

  it('deviation is 7.5 m/s (Bunkers et al. 2000)', () => {
    expect(BUNKERS_DEVIATION_MPS).toBe(7.5)
  })
})

describe('streamwise vorticity share', () => {
  // A hodograph arc centred on the storm motion has shear everywhere across the storm-relative wind, so its
  // horizontal vorticity is all streamwise (circular-hodograph geometry, Markowski and Richardson 2010, from memory).
  const arc = (clockwise: boolean): { h: number[], u: number[], v: number[] } => {
    const h: number[] = []
    const u: number[] = []
    const v: number[] = []
    for (let z = 0; z <= 1000; z += 50) {
      const phi = clockwise ? Math.PI / 2 - (Math.PI / 2) * (z / 1000) : (Math.PI / 2) * (z / 1000)
      h.push(z)
      u.push(5 + 10 * Math.cos(phi))
      v.push(5 + 10 * Math.sin(phi))
    }
    return { h, u, v }
  }

  it('an arc turning clockwise around the storm motion is all streamwise: share +1, and its SRH is positive', () => {
    const { h, u, v } = arc(true)
    expect(streamwiseVorticityShare(h, u, v, { topM: 500, stormUMps: 5, stormVMps: 5 })).toBeCloseTo(1, 9)
    expect(stormRelativeHelicity(h, u, v, { topM: 500, stormUMps: 5, stormVMps: 5 }).totalM2s2).toBeGreaterThan(0)
  })

  it('the same arc turning anticlockwise gives share -1 (antistreamwise)', () => {
    const { h, u, v } = arc(false)
    expect(streamwiseVorticityShare(h, u, v, { topM: 500, stormUMps: 5, stormVMps: 5 })).toBeCloseTo(-1, 9)
  })

  it('straight hodograph with the storm on its line: all crosswise, share 0 (definition of streamwise vorticity, Doswell 1991)', () => {
    expect(streamwiseVorticityShare([0, 500, 1000], [0, 5, 10], [0, 0, 0], { topM: 500, stormUMps: 20, stormVMps: 0 })).toBeCloseTo(0, 12)
  })
})

describe('convective context in analyseProfile', () => {
  const kt = (mps: number): number => mps / MPS_PER_KT
  const deep: LevelInput[] = [0, 250, 500, 750, 1000, 3000, 6000, 9000].map((z, i) => {
    // the SRH test hodograph in the lowest 750 m, then westerly shear aloft
    const uMps = [0, 20, 10, 0, 0, 10, 20, 30][i]!
    const vMps = [20, 0, 0, 10, 10, 10, 10, 10][i]!
    const speed = Math.hypot(uMps, vMps)
    const dir = ((Math.atan2(-uMps, -vMps) * 180) / Math.PI + 360) % 360 || 360
    return { heightM: z, directionDeg: dir, speedKt: kt(speed) }
  })

  it('is available for a profile to 6 km, with SRH consistent with the helicity function and a 7.5 m/s deviation', () => {
    const r = analyseProfile({ heightReference: 'AGL', levels: deep })
    if (!r.convective.available) throw new Error(r.convective.reason)
    const c = r.convective
    const devKt = Math.hypot(c.bunkersRight.uKt - c.meanWind0to6kmKt.uKt, c.bunkersRight.vKt - c.meanWind0to6kmKt.vKt)
    expect(devKt * MPS_PER_KT).toBeCloseTo(7.5, 9)
    const h = deep.map(l => l.heightM!)
    const u = r.levels.map(l => l.uKt * MPS_PER_KT)
    const v = r.levels.map(l => l.vKt * MPS_PER_KT)
    const srh1 = stormRelativeHelicity(h, u, v, { topM: 1000, stormUMps: c.bunkersRight.uKt * MPS_PER_KT, stormVMps: c.bunkersRight.vKt * MPS_PER_KT })
    expect(c.srh0to1kmM2s2).toBeCloseTo(srh1.totalM2s2, 6)
    // bulk shear: 6 km wind (20, 10) minus surface (0, 20) m/s = |(20, -10)| = 22.36 m/s (vector difference, by hand)
    expect(c.bulkShear0to6kmKt * MPS_PER_KT).toBeCloseTo(Math.hypot(20, -10), 6)
  })

  it('is not available, with a reason, for a profile that stops short of 6 km', () => {
    const r = analyseProfile({ heightReference: 'AGL', levels: deep.slice(0, 6) })
    expect(r.convective.available).toBe(false)
    if (!r.convective.available) expect(r.convective.reason).toMatch(/6 km/)
  })
})

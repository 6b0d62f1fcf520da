import { describe, expect, it } from 'vitest'
import { DEFAULT_SHEAR_CLASS_BOUNDS_KT_PER_100FT, WindValidationError, analyseProfile, classifyShear } from '../../../shared/wind'
import type { LevelInput, ProfileAnalysisInput } from '../../../shared/wind'

const issuesOf = (input: unknown): { index?: number, field: string, message: string }[] => {
  try {
    analyseProfile(input as ProfileAnalysisInput)
  }
  catch (e) {
    if (e instanceof WindValidationError) return e.issues
    throw e
  }
  throw new Error('expected a WindValidationError')
}
const agl = (levels: LevelInput[], extra: Partial<ProfileAnalysisInput> = {}): ProfileAnalysisInput => ({ heightReference: 'AGL', levels, ...extra })

describe('profile validation', () => {
  it('needs at least two levels', () => {
    expect(issuesOf(agl([{ heightM: 10, directionDeg: 90, speedKt: 5 }]))[0]!.field).toBe('levels')
  })

  it('direction 0..360 with 360 = north; ignored when the speed is 0 (WMO convention)', () => {
    const r = analyseProfile(agl([{ heightM: 0, directionDeg: 999, speedKt: 0 }, { heightM: 100, directionDeg: 360, speedKt: 10 }]))
    expect(r.levels[0]).toMatchObject({ directionDeg: 0, speedKt: 0 })
    expect(r.levels[1]!.vKt).toBeCloseTo(-10, 12)
    expect(issuesOf(agl([{ heightM: 0, directionDeg: 361, speedKt: 5 }, { heightM: 100, directionDeg: 10, speedKt: 10 }]))[0]).toMatchObject({ index: 0, field: 'levels[0].directionDeg' })
  })

  it('speed 0..250 kt after conversion, exactly one speed field', () => {
    expect(issuesOf(agl([{ heightM: 0, directionDeg: 90, speedKt: 251 }, { heightM: 100, directionDeg: 10, speedKt: 10 }]))[0]!.field).toBe('levels[0].speedKt')
    expect(issuesOf(agl([{ heightM: 0, directionDeg: 90, speedMps: 130 }, { heightM: 100, directionDeg: 10, speedKt: 10 }]))[0]!.field).toBe('levels[0].speedMps')
    expect(issuesOf(agl([{ heightM: 0, directionDeg: 90, speedKt: 5, speedKmh: 9 }, { heightM: 100, directionDeg: 10, speedKt: 10 }]))[0]!.message).toMatch(/one speed/)
    // 36 km/h = 10 m/s = 19.438 kt (exact factors)
    const r = analyseProfile(agl([{ heightM: 0, directionDeg: 90, speedKmh: 36 }, { heightM: 100, directionDeg: 90, speedMps: 10 }]))
    expect(r.levels[0]!.speedKt).toBeCloseTo(10 * 3600 / 1852, 12)
    expect(r.levels[1]!.speedKt).toBeCloseTo(10 * 3600 / 1852, 12)
  })

  it('exactly one height field; heights at or above the ground after conversion and below 20 km', () => {
    expect(issuesOf(agl([{ heightM: 0, heightFt: 0, directionDeg: 90, speedKt: 5 }, { heightM: 100, directionDeg: 10, speedKt: 10 }]))[0]!.message).toMatch(/one height/)
    expect(issuesOf({ heightReference: 'MSL', elevationM: 300, levels: [{ heightM: 250, directionDeg: 90, speedKt: 5 }, { heightM: 400, directionDeg: 10, speedKt: 10 }] })[0]).toMatchObject({ index: 0 })
    expect(issuesOf(agl([{ heightM: 0, directionDeg: 90, speedKt: 5 }, { heightM: 20000, directionDeg: 10, speedKt: 10 }]))[0]!.message).toMatch(/20 km/)
    expect(issuesOf({ heightReference: 'MSL', levels: [{ heightM: 250, directionDeg: 90, speedKt: 5 }, { heightM: 400, directionDeg: 10, speedKt: 10 }] })[0]!.message).toMatch(/elevation/)
  })

  it('MSL feet and pressure levels are converted with the airfield elevation (1 ft = 0.3048 m; ICAO standard atmosphere 850 hPa = 1457 m)', () => {
    const r = analyseProfile({
      heightReference: 'MSL',
      elevationM: 100,
      levels: [{ heightFt: 1000 / 0.3048 * 0.11, directionDeg: 90, speedKt: 5 }, { pressureHpa: 850, directionDeg: 200, speedKt: 30 }],
    })
    expect(r.levels[0]!.heightAglM).toBeCloseTo(10, 9)
    expect(Math.abs(r.levels[1]!.heightAglM - 1357)).toBeLessThan(0.5)
    expect(r.warnings.map(w => w.code)).toContain('standard-atmosphere')
  })

  it('equal heights with the same wind are merged with a warning; with different winds refused naming both', () => {
    const merged = analyseProfile(agl([
      { heightM: 10, directionDeg: 90, speedKt: 5 },
      { heightM: 300, directionDeg: 100, speedKt: 20 },
      { heightFt: 10 / 0.3048, directionDeg: 90, speedMps: 5 * 1852 / 3600 },
    ]))
    expect(merged.levels).toHaveLength(2)
    expect(merged.warnings.find(w => w.code === 'levels-merged')?.indices).toEqual([0, 2])
    const refused = issuesOf(agl([
      { heightM: 10, directionDeg: 90, speedKt: 5 },
      { heightM: 300, directionDeg: 100, speedKt: 20 },
      { heightM: 10, directionDeg: 120, speedKt: 5 },
    ]))
    expect(refused[0]!.message).toMatch(/levels 0 and 2/)
  })

  it('a gust only on the surface level, never below the mean', () => {
    expect(issuesOf(agl([{ heightM: 10, directionDeg: 90, speedKt: 5 }, { heightM: 300, directionDeg: 100, speedKt: 20, gustKt: 30 }]))[0]!.field).toBe('levels[1].gustKt')
    expect(issuesOf(agl([{ heightM: 10, directionDeg: 90, speedKt: 15, gustKt: 10 }, { heightM: 300, directionDeg: 100, speedKt: 20 }]))[0]!.field).toBe('levels[0].gustKt')
  })

  it('collects every problem in one error, with indices and fields', () => {
    const issues = issuesOf({ heightReference: 'up', levels: [{ heightM: 'x', directionDeg: 90, speedKt: -1 }, null], runwayEnds: [{ designator: '99', trueHeadingDeg: 400 }] })
    expect(issues.map(i => i.field)).toEqual(expect.arrayContaining(['heightReference', 'levels[0].heightM', 'levels[0].speedKt', 'levels[1]', 'runwayEnds[0].designator', 'runwayEnds[0].trueHeadingDeg']))
  })
})

describe('grid, coverage and surface', () => {
  it('every 30 m from the ground to 600 m plus the original levels, linear in u and v, nothing past the data', () => {
    const r = analyseProfile(agl([{ heightM: 0, directionDeg: 270, speedKt: 10 }, { heightM: 45, directionDeg: 360, speedKt: 10 }, { heightM: 500, directionDeg: 360, speedKt: 30 }]))
    expect(r.grid.map(p => p.heightAglM)).toEqual([0, 30, 45, 60, 90, 120, 150, 180, 210, 240, 270, 300, 330, 360, 390, 420, 450, 480, 500])
    // 30 m is 2/3 of the way from (10, 0) to (0, -10) in u and v: (3.333, -6.667), not 10 kt from 330°
    const p30 = r.grid[1]!
    expect(p30.uKt).toBeCloseTo(10 / 3, 9)
    expect(p30.vKt).toBeCloseTo(-20 / 3, 9)
    expect(p30.speedKt).toBeCloseTo(Math.hypot(10 / 3, 20 / 3), 9)
    expect(r.coverage).toMatchObject({ lowestAglM: 0, highestAglM: 500, reaches600m: false, startsAtSurface: true })
    expect(r.warnings.map(w => w.code)).toContain('short-of-600m')
    expect(r.shear.surfaceTo600m).toBeNull()
    expect(r.shear.surfaceTo600mReason).toMatch(/short of 600 m/)
  })

  it('without a level within 30 m of the ground: no surface components, said so, nothing invented', () => {
    const r = analyseProfile(agl([{ heightM: 60, directionDeg: 270, speedKt: 10 }, { heightM: 700, directionDeg: 300, speedKt: 30 }], { runwayEnds: [{ designator: '27', trueHeadingDeg: 270 }] }))
    expect(r.surface).toBeNull()
    expect(r.surfaceReason).toMatch(/30 m/)
    expect(r.runwayEnds[0]!.surface).toBeNull()
    expect(r.runwayEnds[0]!.surfaceReason).toMatch(/surface/)
    expect(r.runwayEnds[0]!.byHeight[0]!.heightAglM).toBe(60)
    expect(r.runwayEnds[0]!.arrival!.complete).toBe(false)
    expect(r.warnings.map(w => w.code)).toContain('no-surface-level')
  })
})

describe('shear in the lowest 600 m', () => {
  it('6 kt of vector difference over 30 m is 6.096 kt per 100 ft and 3.0867 m/s per 30 m (100 ft = 30.48 m; 1 kt = 1852/3600 m/s)', () => {
    const r = analyseProfile(agl([{ heightM: 0, directionDeg: 270, speedKt: 10 }, { heightM: 30, directionDeg: 270, speedKt: 16 }]))
    const layer = r.shear.layers[0]!
    expect(layer.baseM).toBe(0)
    expect(layer.topM).toBe(30)
    expect(layer.shearKtPer100ft).toBeCloseTo(6 * 30.48 / 30, 12)
    expect(layer.shearMpsPer30m).toBeCloseTo(6 * 1852 / 3600, 12)
    expect(layer.intensity).toBe('moderate')
  })

  it('intensity classes light 0-4, moderate 5-8, strong 9-12, severe > 12 kt per 100 ft (ICAO Circular 186 / Doc 9817 table, from memory), editable', () => {
    const b = DEFAULT_SHEAR_CLASS_BOUNDS_KT_PER_100FT
    expect([3, 4, 5, 8, 9, 12, 12.5].map(x => classifyShear(x, b))).toEqual(['light', 'light', 'moderate', 'moderate', 'strong', 'strong', 'severe'])
    const r = analyseProfile(agl([{ heightM: 0, directionDeg: 270, speedKt: 10 }, { heightM: 30, directionDeg: 270, speedKt: 16 }], { shearClassBoundsKtPer100ft: { lightMaxKtPer100ft: 7 } }))
    expect(r.shear.layers[0]!.intensity).toBe('light')
  })

  it('vector difference, not speed difference: 10 kt from 090° over 10 kt from 270° is 20 kt (vector definition of shear, ICAO Doc 9817)', () => {
    const r = analyseProfile(agl([{ heightM: 0, directionDeg: 90, speedKt: 10 }, { heightM: 600, directionDeg: 270, speedKt: 10 }]))
    expect(r.shear.surfaceTo600m!.vectorDiffKt).toBeCloseTo(20, 9)
    expect(r.shear.surfaceTo600m!.vectorDiffMps).toBeCloseTo(20 * 1852 / 3600, 9)
  })

  it('turning clockwise with height is veering, anticlockwise backing (glossary definition)', () => {
    const veer = analyseProfile(agl([{ heightM: 0, directionDeg: 180, speedKt: 10 }, { heightM: 300, directionDeg: 240, speedKt: 20 }, { heightM: 600, directionDeg: 270, speedKt: 30 }]))
    expect(veer.shear.turnSense).toBe('veering')
    expect(veer.shear.directionTurnDeg).toBeCloseTo(90, 9)
    const back = analyseProfile(agl([{ heightM: 0, directionDeg: 20, speedKt: 10 }, { heightM: 600, directionDeg: 340, speedKt: 30 }]))
    expect(back.shear.turnSense).toBe('backing')
    expect(back.shear.directionTurnSignedDeg).toBeCloseTo(-40, 6)
  })
})

describe('arrival and departure headwind changes per runway end', () => {
  // Runway 27 (heading 270°), wind from 270°: headwind 10 kt at 0 m, 40 kt at 300 m, 20 kt at 600 m.
  const input = agl([
    { heightM: 0, directionDeg: 270, speedKt: 10, gustKt: 20 },
    { heightM: 300, directionDeg: 270, speedKt: 40 },
    { heightM: 600, directionDeg: 270, speedKt: 20 },
  ], { runwayEnds: [{ designator: '27', trueHeadingDeg: 270 }, { designator: '09', trueHeadingDeg: 90 }] })

  it('arrival (600 m down): 20 kt gain 600->300 m, then 30 kt loss 300->0 m as the headwind falls on the way down (performance-decreasing shear definition)', () => {
    const arrival = analyseProfile(input).runwayEnds[0]!.arrival!
    expect(arrival.maxAirspeedGainKt).toBeCloseTo(20, 9)
    expect(arrival.maxAirspeedLossKt).toBeCloseTo(30, 9)
    expect([arrival.lossFromHeightM, arrival.lossToHeightM]).toEqual([300, 0])
    expect(arrival.exceedsAlertingPractice15Kt).toBe(true)
    expect(arrival.complete).toBe(true)
  })

  it('departure (ground up): 30 kt gain then 20 kt loss as the headwind falls with height', () => {
    const departure = analyseProfile(input).runwayEnds[0]!.departure!
    expect(departure.maxAirspeedGainKt).toBeCloseTo(30, 9)
    expect(departure.maxAirspeedLossKt).toBeCloseTo(20, 9)
    expect([departure.lossFromHeightM, departure.lossToHeightM]).toEqual([300, 600])
  })

  it('the other end meets the mirror image: tailwind growing on the way down is a loss', () => {
    const arrival = analyseProfile(input).runwayEnds[1]!.arrival!
    expect(arrival.maxAirspeedLossKt).toBeCloseTo(20, 9)
    expect(arrival.maxAirspeedGainKt).toBeCloseTo(30, 9)
  })

  it('surface components include the gust; a 14.9 kt change stays under the 15 kt alerting practice (national rule after ICAO Annex 3)', () => {
    const end = analyseProfile(input).runwayEnds[0]!
    expect(end.surface).toMatchObject({ headwindKt: 10, gustHeadwindKt: 20 })
    const calm = analyseProfile(agl([{ heightM: 0, directionDeg: 270, speedKt: 10 }, { heightM: 600, directionDeg: 270, speedKt: 24.9 }], { runwayEnds: [{ designator: '27', trueHeadingDeg: 270 }] }))
    expect(calm.runwayEnds[0]!.departure!.exceedsAlertingPractice15Kt).toBe(false)
    expect(calm.runwayEnds[0]!.arrival!.maxAirspeedLossKt).toBeCloseTo(14.9, 9)
  })

  it('a designator more than 10° off the magnetic heading is reported', () => {
    const r = analyseProfile({ ...input, runwayEnds: [{ designator: '27', trueHeadingDeg: 270, magneticHeadingDeg: 285 }] })
    expect(r.runwayEnds[0]!.designatorCheck!.mismatch).toBe(true)
    expect(r.warnings.find(w => w.code === 'designator-mismatch')?.designator).toBe('27')
  })
})

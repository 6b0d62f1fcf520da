import { describe, expect, it } from 'vitest'
import {
  WindValidationError, analyseProfile, heightAboveReferenceM, hypsometricThicknessM, pressureAtElevationHpa,
} from '../../../shared/wind'
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
const heightOf = (r: ReturnType<typeof analyseProfile>, sourceIndex: number) => r.levels.find(l => l.sourceIndex === sourceIndex)!.heightAglM

describe('pressure levels referred to the QNH (ICAO standard atmosphere, Doc 7488 formula)', () => {
  it('1000 hPa under a QNH of 1030 hPa is 248.6 m; under 1013.25 hPa 110.9 m (computed from the Doc 7488 formula)', () => {
    expect(heightAboveReferenceM(1000, 1030)).toBeCloseTo(248.6, 1)
    expect(heightAboveReferenceM(1000, 1013.25)).toBeCloseTo(110.9, 1)
  })

  it('a sea-level field with QNH 1030 places a 1000 hPa level at 248.6 m above ground, about 138 m higher than without', () => {
    const levels: LevelInput[] = [{ heightM: 0, directionDeg: 200, speedKt: 10 }, { pressureHpa: 1000, directionDeg: 230, speedKt: 25 }]
    const withQnh = analyseProfile({ heightReference: 'AGL', elevationM: 0, qnhHpa: 1030, levels })
    expect(heightOf(withQnh, 1)).toBeCloseTo(248.6, 1)
    expect(withQnh.levels.find(l => l.sourceIndex === 1)!.heightFrom).toBe('qnh')
    expect(withQnh.warnings.some(w => w.code === 'standard-atmosphere')).toBe(false)
    const without = analyseProfile({ heightReference: 'AGL', elevationM: 0, levels })
    expect(heightOf(without, 1)).toBeCloseTo(110.9, 1)
    const warning = without.warnings.find(w => w.code === 'standard-atmosphere')!
    expect(warning.message).toMatch(/^Heights from the standard atmosphere: no QNH given/)
    expect(warning.indices).toEqual([1])
    expect(heightOf(withQnh, 1) - heightOf(without, 1)).toBeCloseTo(137.7, 0)
  })

  it('an elevated field: the QNH gives the station pressure, heights stay above the ground (formula inverse round-trips)', () => {
    // 300 m field under QNH 1020: the station pressure by the same formula, and 900 hPa measured from there.
    const station = pressureAtElevationHpa(1020, 300)
    expect(heightAboveReferenceM(station, 1020)).toBeCloseTo(300, 6)
    const r = analyseProfile({ heightReference: 'AGL', elevationM: 300, qnhHpa: 1020, levels: [{ heightM: 0, directionDeg: 10, speedKt: 5 }, { pressureHpa: 900, directionDeg: 30, speedKt: 20 }] })
    expect(heightOf(r, 1)).toBeCloseTo(heightAboveReferenceM(900, 1020) - 300, 6)
  })

  it('with the station pressure (QFE), a level is placed as an altimeter set to QFE shows it, with no elevation needed', () => {
    const r = analyseProfile({ heightReference: 'AGL', surfacePressureHpa: 1000, levels: [{ heightM: 0, directionDeg: 10, speedKt: 5 }, { pressureHpa: 970, directionDeg: 30, speedKt: 20 }] })
    expect(heightOf(r, 1)).toBeCloseTo(heightAboveReferenceM(970, 1000), 9)
    expect(r.levels.find(l => l.sourceIndex === 1)!.heightFrom).toBe('station-pressure')
  })

  it('refuses a QNH outside 850-1100 hPa naming the field', () => {
    const issues = issuesOf({ heightReference: 'AGL', elevationM: 0, qnhHpa: 103, levels: [{ heightM: 0, directionDeg: 10, speedKt: 5 }, { pressureHpa: 970, directionDeg: 30, speedKt: 20 }] })
    expect(issues[0]).toMatchObject({ field: 'qnhHpa' })
    expect(issues[0]!.message).toMatch(/QNH must be from 850 to 1100 hPa, got 103/)
  })
})

describe('pressure levels with temperatures: the hypsometric equation, layer by layer', () => {
  // Wallace and Hobbs, Atmospheric Science: An Introductory Survey, 2nd ed. (2006), Exercise 3.3 (from memory):
  // thickness of the 1000-500 hPa layer is 5846 m at a mean virtual temperature of 15 °C (288 K) and 4730 m at
  // -40 °C (233 K). The equation itself: AMS Glossary of Meteorology, "hypsometric equation" (seen).
  it('1000-500 hPa is 5846 m at 15 °C and 4730 m at -40 °C (Wallace and Hobbs, Exercise 3.3)', () => {
    expect(Math.abs(hypsometricThicknessM(1000, 500, 288.15) - 5846)).toBeLessThan(2)
    expect(Math.abs(hypsometricThicknessM(1000, 500, 233.15) - 4730)).toBeLessThan(2)
  })

  it('the engine places 500 hPa 5846 m above a station at 1000 hPa, and an isothermal chain 850, 700, 500 adds up to the same', () => {
    const one = analyseProfile({
      heightReference: 'AGL',
      surfacePressureHpa: 1000,
      levels: [{ heightM: 0, directionDeg: 200, speedKt: 10, temperatureC: 15 }, { pressureHpa: 500, temperatureC: 15, directionDeg: 250, speedKt: 60 }],
    })
    expect(Math.abs(heightOf(one, 1) - 5846)).toBeLessThan(2)
    expect(one.levels.find(l => l.sourceIndex === 1)!.heightFrom).toBe('hypsometric')
    const chain = analyseProfile({
      heightReference: 'AGL',
      surfacePressureHpa: 1000,
      levels: [
        { heightM: 0, directionDeg: 200, speedKt: 10, temperatureC: 15 },
        { pressureHpa: 700, temperatureC: 15, directionDeg: 230, speedKt: 40 },
        { pressureHpa: 850, temperatureC: 15, directionDeg: 220, speedKt: 30 },
        { pressureHpa: 500, temperatureC: 15, directionDeg: 250, speedKt: 60 },
      ],
    })
    expect(heightOf(chain, 3)).toBeCloseTo(heightOf(one, 1), 6)
    expect(heightOf(chain, 2)).toBeLessThan(heightOf(chain, 1))
  })

  it('a warmer layer is thicker than the standard one: mean temperatures are used layer by layer', () => {
    const levels = (t: number): LevelInput[] => [{ heightM: 0, directionDeg: 200, speedKt: 10, temperatureC: t }, { pressureHpa: 950, temperatureC: t, directionDeg: 220, speedKt: 20 }]
    const warm = analyseProfile({ heightReference: 'AGL', surfacePressureHpa: 1000, levels: levels(30) })
    const cold = analyseProfile({ heightReference: 'AGL', surfacePressureHpa: 1000, levels: levels(-10) })
    // Thickness scales with the mean absolute temperature (hypsometric equation).
    expect(heightOf(warm, 1) / heightOf(cold, 1)).toBeCloseTo(303.15 / 263.15, 9)
  })

  it('a level may give a height and a pressure: the height wins', () => {
    const r = analyseProfile({ heightReference: 'AGL', elevationM: 0, levels: [{ heightM: 0, directionDeg: 10, speedKt: 5 }, { heightM: 300, pressureHpa: 900, directionDeg: 30, speedKt: 20 }] })
    expect(heightOf(r, 1)).toBe(300)
    expect(r.warnings.some(w => w.code === 'standard-atmosphere')).toBe(false)
  })

  it('refuses a temperature outside -90 to 60 °C naming the level', () => {
    expect(issuesOf({ heightReference: 'AGL', levels: [{ heightM: 0, directionDeg: 10, speedKt: 5, temperatureC: 99 }, { heightM: 100, directionDeg: 30, speedKt: 20 }] })[0]).toMatchObject({ index: 0, field: 'levels[0].temperatureC' })
  })
})

describe('MSL levels rounded below the elevation', () => {
  it('a level 0.2 m below the elevation is the surface, with a warning; 1.5 m below is refused', () => {
    // 1 ft = 0.3048 m exactly: a 1,000 ft field given as 328 ft-rounded heights sits a fraction of a metre off.
    const r = analyseProfile({ heightReference: 'MSL', elevationM: 100.2, levels: [{ heightM: 100, directionDeg: 200, speedKt: 10 }, { heightM: 400, directionDeg: 230, speedKt: 20 }] })
    expect(r.surface!.heightAglM).toBe(0)
    expect(r.warnings.find(w => w.code === 'surface-below-elevation')!.indices).toEqual([0])
    expect(issuesOf({ heightReference: 'MSL', elevationM: 101.5, levels: [{ heightM: 100, directionDeg: 200, speedKt: 10 }, { heightM: 400, directionDeg: 230, speedKt: 20 }] })[0]).toMatchObject({ index: 0, field: 'levels[0].heightM' })
    // AGL heights below zero stay refused: there is no rounding of an elevation to forgive.
    expect(issuesOf({ heightReference: 'AGL', levels: [{ heightM: -0.2, directionDeg: 200, speedKt: 10 }, { heightM: 400, directionDeg: 230, speedKt: 20 }] })[0]).toMatchObject({ index: 0 })
  })
})

describe('a gust on a calm mean keeps its direction', () => {
  it('calm mean gusting 15 kt from 200° on runway 09: gust crosswind 14.1 kt from the right (V·sin θ, FAA crosswind chart convention)', () => {
    const r = analyseProfile({
      heightReference: 'AGL',
      levels: [{ heightM: 0, directionDeg: 200, speedKt: 0, gustKt: 15 }, { heightM: 300, directionDeg: 220, speedKt: 20 }],
      runwayEnds: [{ designator: '09', trueHeadingDeg: 90 }],
    })
    const s = r.runwayEnds[0]!.surface!
    // θ = 200 - 90 = 110°: 15·sin 110° = 14.095 kt (right), 15·cos 110° = -5.130 kt (tailwind).
    expect(s.gustCrosswindKt).toBeCloseTo(15 * Math.sin(110 * Math.PI / 180), 9)
    expect(s.gustCrosswindKt!).toBeCloseTo(14.1, 1)
    expect(s.gustHeadwindKt!).toBeCloseTo(-5.13, 2)
    expect(s.headwindKt).toBeCloseTo(0, 12)
  })
})

describe('the 15 kt check on the final approach and initial climb corridor', () => {
  // A headwind on runway 36 growing evenly from 0 at the ground to 20 kt at 600 m.
  const steady: ProfileAnalysisInput = {
    heightReference: 'AGL',
    levels: [{ heightM: 0, directionDeg: 360, speedKt: 0 }, { heightM: 600, directionDeg: 360, speedKt: 20 }],
    runwayEnds: [{ designator: '36', trueHeadingDeg: 360 }],
  }

  it('the corridor reaches 3 NM x tan 3° = 291.2 m on arrival and 3 NM x tan 6° = 584.0 m on departure (1 NM = 1852 m)', () => {
    const r = analyseProfile(steady)
    expect(r.paths.arrivalCorridorTopM).toBeCloseTo(5556 * Math.tan(3 * Math.PI / 180), 6)
    expect(r.paths.arrivalCorridorTopM).toBeCloseTo(291.2, 1)
    expect(r.paths.departureCorridorTopM).toBeCloseTo(584.0, 1)
  })

  it('a wind strengthening steadily with height trips the 0-600 m figure but not the approach corridor', () => {
    const end = analyseProfile(steady).runwayEnds[0]!
    expect(end.arrival!.maxAirspeedLossKt).toBeCloseTo(20, 9)
    expect(end.arrival!.exceedsAlertingPractice15Kt).toBe(true)
    // Within the corridor the headwind falls from 20 x 291.2 / 600 = 9.71 kt to 0.
    expect(end.arrivalCorridor!.maxAirspeedLossKt).toBeCloseTo(20 * 291.2 / 600, 1)
    expect(end.arrivalCorridor!.exceedsAlertingPractice15Kt).toBe(false)
    expect(end.arrivalCorridor!.startHeightM).toBeCloseTo(291.2, 1)
    expect(end.arrivalCorridor!.complete).toBe(true)
  })

  it('the corridor length is a setting: 6 NM on a 3° path reaches 582.4 m', () => {
    const r = analyseProfile({ ...steady, paths: { corridorNm: 6 } })
    expect(r.paths.arrivalCorridorTopM).toBeCloseTo(11112 * Math.tan(3 * Math.PI / 180), 6)
    expect(issuesOf({ ...steady, paths: { corridorNm: 0 } })[0]).toMatchObject({ field: 'paths.corridorNm' })
  })
})

describe('F-factor, 1 km average, horizontal wind only', () => {
  // Worked by hand from the definition F = (dWx/dt)/g (Bowles 1990; the horizontal term only), with the 1 km average
  // as the issue defines it; one published figure (Honeywell 2019) is checked below. 0.1 as the hazard level: airborne
  // advisories from F of about 0.1-0.15 (Aerocrew News, "Windshear: the science, equipment and mitigation", 2024, seen).
  // Runway 36, headwind 0 at the ground growing evenly to 30 kt at 300 m and constant above.
  const input: ProfileAnalysisInput = {
    heightReference: 'AGL',
    levels: [{ heightM: 0, directionDeg: 360, speedKt: 0 }, { heightM: 300, directionDeg: 360, speedKt: 30 }, { heightM: 600, directionDeg: 360, speedKt: 30 }],
    runwayEnds: [{ designator: '36', trueHeadingDeg: 360 }],
  }

  it('arrival on a 3° path at 140 kt: the strongest stretch is the last kilometre before the threshold', () => {
    const f = analyseProfile(input).runwayEnds[0]!.fFactor.arrival!
    expect(f.basis).toBe('horizontal-wind-only')
    const kt = 1852 / 3600
    const drop = 1000 * Math.tan(3 * Math.PI / 180) // 52.408 m of height over 1 km of track
    // Headwind falls by 30/300 kt per metre: 5.2408 kt = 2.6961 m/s over the stretch; the tailwind rises as much.
    const dWx = (30 / 300) * drop * kt
    // Middle height 26.204 m: headwind 2.6204 kt, GS = 140 - 2.6204 = 137.3796 kt = 70.674 m/s.
    const gs = (140 - (30 / 300) * drop / 2) * kt
    expect(f.maxF).toBeCloseTo(dWx * gs / (9.80665 * 1000), 9)
    expect(f.maxF).toBeCloseTo(0.01943, 4)
    expect(f).toMatchObject({ startTrackM: 1000, endTrackM: 0 })
    expect(f.startHeightM).toBeCloseTo(drop, 9)
    expect(f.groundSpeedKt).toBeCloseTo(137.38, 2)
    // Stretches start every 10 m while the upper end is at or below 600 m: 600/tan 3° = 11,448.7 m of track.
    expect(f.stretchesTotal).toBe(1045)
    expect(f.stretchesCovered).toBe(1045)
  })

  it('departure: a headwind that grows with height is a performance gain, so F stays at or below zero', () => {
    const f = analyseProfile(input).runwayEnds[0]!.fFactor.departure!
    expect(f.maxF).toBeLessThanOrEqual(1e-12)
  })

  it('the reciprocal runway meets the same shear as a growing tailwind on departure: F > 0, hazardous from 0.1', () => {
    const strong: ProfileAnalysisInput = { ...input, levels: [{ heightM: 0, directionDeg: 180, speedKt: 0 }, { heightM: 100, directionDeg: 180, speedKt: 60 }, { heightM: 600, directionDeg: 180, speedKt: 60 }] }
    const f = analyseProfile(strong).runwayEnds[0]!.fFactor.departure!
    // 6° climb: 1 km of track rises 105.1 m, so a stretch from the threshold sees the tailwind rise 60 kt
    // (it is capped at 100 m): 30.867 m/s; middle height 52.55 m: tailwind 31.53 kt, GS = 160 + 31.53 kt.
    const kt = 1852 / 3600
    const gs = (160 + 60 * (500 * Math.tan(6 * Math.PI / 180)) / 100) * kt
    expect(f.maxF).toBeCloseTo(60 * kt * gs / 9806.65, 9)
    expect(f.maxF).toBeGreaterThanOrEqual(0.1)
    expect(f.startTrackM).toBe(0)
  })

  it('F = 0.15 met at 150 kt: the engine gives the figure the published example starts from, and 0.15 x 150 kt x 24 s = 911 ft', () => {
    // Honeywell Aerospace, "Radar Corner: Follow-Up to Understanding Windshear Detection Systems" (2019, seen): the
    // air-mass F-factor from horizontal wind is (dWx/dx)(V/g); "an aircraft traveling at 150 knots [that] encountered a
    // windshear with an F-factor of 0.15 for 24 seconds (1 NM) would lose 911 feet of altitude" without an escape
    // manoeuvre. Here: a headwind on runway 36 growing evenly from calm at the ground, fitted so that the last
    // kilometre before the threshold (52.4 m of height on 3°) gives F = 0.15 at a ground speed of 150 kt.
    const kt = 1852 / 3600
    const g = 9.80665
    const drop = 1000 * Math.tan(3 * Math.PI / 180)
    const dWxKt = 0.15 * g * 1000 / (150 * kt) / kt // 37.05 kt over the stretch
    const perM = dWxKt / drop // kt of headwind per metre of height
    const r = analyseProfile({
      heightReference: 'AGL',
      levels: [{ heightM: 0, directionDeg: 360, speedKt: 0 }, { heightM: 100, directionDeg: 360, speedKt: perM * 100 }, { heightM: 600, directionDeg: 360, speedKt: perM * 100 }],
      runwayEnds: [{ designator: '36', trueHeadingDeg: 360 }],
      // Ground speed at the stretch's middle (26.2 m) = true airspeed - headwind there = 150 kt.
      paths: { arrivalTrueAirspeedKt: 150 + perM * drop / 2 },
    })
    const f = r.runwayEnds[0]!.fFactor.arrival!
    expect(f.groundSpeedKt).toBeCloseTo(150, 9)
    expect(f.maxF).toBeCloseTo(0.15, 9)
    // The published consequence: climb performance lost at F x V, kept up for 24 s.
    const lostFt = f.maxF * f.groundSpeedKt * kt * 24 / 0.3048 // 1 ft = 0.3048 m exactly
    expect(Math.round(lostFt)).toBe(911)
  })

  it('stretches the data does not reach are left out, not extrapolated', () => {
    const short = analyseProfile({ ...input, levels: [{ heightM: 0, directionDeg: 360, speedKt: 0 }, { heightM: 150, directionDeg: 360, speedKt: 15 }] })
    const f = short.runwayEnds[0]!.fFactor.arrival!
    expect(f.stretchesCovered).toBeLessThan(f.stretchesTotal)
    // Upper end at or below 150 m: 150/tan 3° = 2,862.2 m of track, so stretches starting at 0..1,860 m: 187.
    expect(f.stretchesCovered).toBe(187)
  })
})

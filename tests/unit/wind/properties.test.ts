import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  WindValidationError, analyseProfile, bunkersStormMotion, magneticDeclinationDeg, normaliseHeadingDeg, parseCodedReport,
  pathChange, pressureToHeightM, runwayComponents, runwayTrueBearingDeg, stormRelativeHelicity,
} from '../../../shared/wind'
import type { LevelInput, ProfileAnalysisInput } from '../../../shared/wind'

const dir = fc.double({ min: 0, max: 360, noNaN: true })
const speed = fc.double({ min: 0, max: 250, noNaN: true })
const angle = fc.double({ min: -720, max: 720, noNaN: true })
const TOL = 1e-9

// Random valid profiles: distinct heights from the ground up, winds within range.
const profileArb = (maxHeightM: number, minLevels = 2, maxLevels = 30): fc.Arbitrary<ProfileAnalysisInput> =>
  fc.uniqueArray(fc.integer({ min: 0, max: maxHeightM }), { minLength: minLevels, maxLength: maxLevels })
    .chain(heights => fc.tuple(fc.constant(heights), fc.array(fc.tuple(dir, speed), { minLength: heights.length, maxLength: heights.length })))
    .map(([heights, winds]) => ({
      heightReference: 'AGL' as const,
      levels: heights.map((h, i): LevelInput => ({ heightM: h, directionDeg: winds[i]![0], speedKt: winds[i]![1] })),
      runwayEnds: [{ designator: '09', trueHeadingDeg: 90 }, { designator: '27', trueHeadingDeg: 270 }],
    }))

describe('runway component properties', () => {
  it('turning wind and runway by the same angle leaves the components unchanged', () => {
    fc.assert(fc.property(dir, speed, dir, angle, (d, s, hdg, a) => {
      const c0 = runwayComponents(d, s, hdg)
      const c1 = runwayComponents(normaliseHeadingDeg(d + a), s, normaliseHeadingDeg(hdg + a))
      expect(c1.headwindKt).toBeCloseTo(c0.headwindKt, 8)
      expect(c1.crosswindKt).toBeCloseTo(c0.crosswindKt, 8)
    }))
  })

  it('headwind² + crosswind² = speed²', () => {
    fc.assert(fc.property(dir, speed, dir, (d, s, hdg) => {
      const c = runwayComponents(d, s, hdg)
      expect(Math.abs(c.headwindKt ** 2 + c.crosswindKt ** 2 - s * s)).toBeLessThanOrEqual(1e-9 * Math.max(1, s * s))
    }))
  })

  it('the two ends of one runway get opposite components', () => {
    fc.assert(fc.property(dir, speed, fc.double({ min: 0, max: 180, noNaN: true }), (d, s, hdg) => {
      const a = runwayComponents(d, s, hdg)
      const b = runwayComponents(d, s, hdg + 180)
      expect(b.headwindKt).toBeCloseTo(-a.headwindKt, 8)
      expect(b.crosswindKt).toBeCloseTo(-a.crosswindKt, 8)
    }))
  })

  it('in a full analysis too: runway 09 and 27 get opposite components at every height', () => {
    fc.assert(fc.property(profileArb(2000), (input) => {
      const [e09, e27] = analyseProfile(input).runwayEnds
      e09!.byHeight.forEach((p, k) => {
        expect(e27!.byHeight[k]!.headwindKt).toBeCloseTo(-p.headwindKt, 8)
        expect(e27!.byHeight[k]!.crosswindKt).toBeCloseTo(-p.crosswindKt, 8)
      })
    }), { numRuns: 200 })
  })
})

describe('interpolation properties', () => {
  it('interpolated vectors lie on the segment between their neighbouring levels (linear in u and v)', () => {
    fc.assert(fc.property(profileArb(1500), (input) => {
      const r = analyseProfile(input)
      for (const p of r.grid) {
        if (p.sourceIndex !== null) continue
        const above = r.levels.findIndex(l => l.heightAglM > p.heightAglM)
        const a = r.levels[above - 1]!
        const b = r.levels[above]!
        const t = (p.heightAglM - a.heightAglM) / (b.heightAglM - a.heightAglM)
        expect(t).toBeGreaterThan(0)
        expect(t).toBeLessThan(1)
        expect(p.uKt).toBeGreaterThanOrEqual(Math.min(a.uKt, b.uKt) - TOL)
        expect(p.uKt).toBeLessThanOrEqual(Math.max(a.uKt, b.uKt) + TOL)
        expect(p.vKt).toBeGreaterThanOrEqual(Math.min(a.vKt, b.vKt) - TOL)
        expect(p.vKt).toBeLessThanOrEqual(Math.max(a.vKt, b.vKt) + TOL)
        expect(p.uKt).toBeCloseTo(a.uKt + t * (b.uKt - a.uKt), 8)
        expect(p.vKt).toBeCloseTo(a.vKt + t * (b.vKt - a.vKt), 8)
      }
      // never past the data
      for (const p of r.grid) {
        expect(p.heightAglM).toBeGreaterThanOrEqual(r.coverage.lowestAglM)
        expect(p.heightAglM).toBeLessThanOrEqual(Math.min(600, r.coverage.highestAglM))
      }
    }), { numRuns: 300 })
  }, 60_000) // a hang guard for a loaded machine, not a speed check
})

describe('path change properties', () => {
  it('the running-extreme scan equals the largest ordered drop and rise over all pairs', () => {
    fc.assert(fc.property(fc.array(fc.double({ min: -250, max: 250, noNaN: true }), { minLength: 2, maxLength: 40 }), fc.boolean(), (hw, up) => {
      const heights = hw.map((_, i) => i * 30)
      const order = up ? 1 : -1
      const seq = up ? hw : [...hw].reverse()
      let loss = 0
      let gain = 0
      for (let i = 0; i < seq.length; i++) {
        for (let j = i + 1; j < seq.length; j++) {
          loss = Math.max(loss, seq[i]! - seq[j]!)
          gain = Math.max(gain, seq[j]! - seq[i]!)
        }
      }
      const r = pathChange(heights, hw, order, true)
      expect(r.maxAirspeedLossKt).toBeCloseTo(loss, 9)
      expect(r.maxAirspeedGainKt).toBeCloseTo(gain, 9)
    }))
  })
})

describe('storm motion and helicity properties', () => {
  const deepSeries = fc.uniqueArray(fc.integer({ min: 1, max: 9999 }), { minLength: 3, maxLength: 40 })
    .chain((inner) => {
      const h = [0, ...inner.sort((a, b) => a - b), 10000]
      const comp = fc.double({ min: -80, max: 80, noNaN: true })
      return fc.tuple(fc.constant(h), fc.array(comp, { minLength: h.length, maxLength: h.length }), fc.array(comp, { minLength: h.length, maxLength: h.length }))
    })

  it('Bunkers deviation is 7.5 m/s and perpendicular to the shear vector; left mirrors right', () => {
    fc.assert(fc.property(deepSeries, ([h, u, v]) => {
      const s = bunkersStormMotion(h, u, v)
      fc.pre(Math.hypot(s.shearUMps, s.shearVMps) > 1e-6)
      const du = s.rightUMps - s.meanUMps
      const dv = s.rightVMps - s.meanVMps
      expect(Math.hypot(du, dv)).toBeCloseTo(7.5, 9)
      expect((du * s.shearUMps + dv * s.shearVMps) / Math.hypot(s.shearUMps, s.shearVMps)).toBeCloseTo(0, 9)
      // right of the shear vector: the cross product shear x deviation points down
      expect(s.shearUMps * dv - s.shearVMps * du).toBeLessThan(0)
      expect(s.leftUMps - s.meanUMps).toBeCloseTo(-du, 9)
      expect(s.leftVMps - s.meanVMps).toBeCloseTo(-dv, 9)
    }))
  })

  it('SRH is additive over adjacent layers and positive + negative = total', () => {
    fc.assert(fc.property(deepSeries, fc.integer({ min: 1, max: 9999 }), ([h, u, v], mid) => {
      const storm = { stormUMps: 3, stormVMps: -2 }
      const all = stormRelativeHelicity(h, u, v, { topM: 10000, ...storm })
      const lower = stormRelativeHelicity(h, u, v, { topM: mid, ...storm })
      const upper = stormRelativeHelicity(h, u, v, { bottomM: mid, topM: 10000, ...storm })
      expect(lower.totalM2s2 + upper.totalM2s2).toBeCloseTo(all.totalM2s2, 6)
      expect(all.positiveM2s2 + all.negativeM2s2).toBeCloseTo(all.totalM2s2, 9)
    }))
  })
})

describe('the module throws nothing but its own validation error', () => {
  const onlyOwnError = (fn: () => unknown): void => {
    try {
      fn()
    }
    catch (e) {
      expect(e).toBeInstanceOf(WindValidationError)
      expect((e as WindValidationError).issues.length).toBeGreaterThan(0)
    }
  }
  const wildNumber = fc.oneof(
    fc.double(), fc.integer({ min: -1000, max: 30000 }), fc.constantFrom(Number.NaN, Infinity, -Infinity, 0, -0, 360, 361, 250, 600, 20000),
  )
  const wildValue = fc.oneof(wildNumber, fc.string(), fc.constant(null), fc.constant(undefined), fc.boolean(), fc.anything())
  const keys = ['heightM', 'heightFt', 'pressureHpa', 'directionDeg', 'speedKt', 'speedMps', 'speedKmh', 'gustKt', 'gustMps', 'gustKmh'] as const
  const wildLevel = fc.oneof(
    fc.record(Object.fromEntries(keys.map(k => [k, wildValue])), { requiredKeys: [] }),
    fc.record(Object.fromEntries(keys.map(k => [k, wildNumber])), { requiredKeys: [] }),
    fc.anything(),
  )
  const wildInput = fc.oneof(
    fc.anything(),
    fc.record({
      heightReference: fc.oneof(fc.constantFrom('AGL', 'MSL'), wildValue),
      elevationM: fc.oneof(wildNumber, wildValue),
      levels: fc.oneof(fc.array(wildLevel, { maxLength: 12 }), wildValue),
      runwayEnds: fc.oneof(fc.array(fc.record({ designator: fc.oneof(fc.constantFrom('09', '27L', '36', '00', ''), wildValue), trueHeadingDeg: wildNumber, magneticHeadingDeg: wildNumber }, { requiredKeys: [] }), { maxLength: 4 }), wildValue),
      shearClassBoundsKtPer100ft: fc.oneof(fc.record({ lightMaxKtPer100ft: wildNumber, moderateMaxKtPer100ft: wildNumber, strongMaxKtPer100ft: wildNumber }, { requiredKeys: [] }), wildValue),
    }, { requiredKeys: [] }),
  )

  it('analyseProfile, on anything', () => {
    fc.assert(fc.property(wildInput, input => onlyOwnError(() => analyseProfile(input as ProfileAnalysisInput))), { numRuns: 2000 })
  })

  it('analyseProfile, on valid-looking profiles with edge values (also never throws for valid ones)', () => {
    fc.assert(fc.property(profileArb(19999, 2, 20), fc.constantFrom('AGL', 'MSL'), fc.integer({ min: -10, max: 3000 }), (input, ref, elevationM) => {
      onlyOwnError(() => analyseProfile({ ...input, heightReference: ref as 'AGL' | 'MSL', elevationM }))
    }), { numRuns: 500 })
    fc.assert(fc.property(profileArb(19999, 2, 20), (input) => {
      expect(() => analyseProfile(input)).not.toThrow()
    }), { numRuns: 500 })
  })

  it('parseCodedReport, on report-like lines and arbitrary strings', () => {
    const token = fc.oneof(
      fc.stringMatching(/^(\d{3}|VRB)P?\d{1,4}(G\d{1,3})?(KT|MPS)$/),
      fc.stringMatching(/^WS\d{0,4}\/?\d{0,6}(KT|MPS)?$/),
      fc.stringMatching(/^\d{3}V\d{3}$/),
      fc.constantFrom('WS', 'ALL', 'RWY', 'R24', 'R07R', 'METAR', 'TAF', 'RMK', 'TEMPO', '9999', 'CAVOK', '='),
      fc.string({ maxLength: 8 }),
    )
    fc.assert(fc.property(fc.array(token, { maxLength: 12 }), fc.option(fc.integer()), (tokens, line) => {
      onlyOwnError(() => parseCodedReport(tokens.join(' '), line ?? undefined))
    }), { numRuns: 2000 })
    fc.assert(fc.property(fc.anything(), x => onlyOwnError(() => parseCodedReport(x as string))), { numRuns: 300 })
  })

  it('magneticDeclinationDeg, on any date and position (a date outside WMM2025 is its own error)', () => {
    fc.assert(fc.property(fc.date({ min: new Date('1900-01-01'), max: new Date('2100-01-01') }), fc.double({ min: -95, max: 95 }), fc.double({ min: -400, max: 400 }), fc.double({ min: -2000, max: 900_000 }),
      (date, latDeg, lonDeg, elevationM) => onlyOwnError(() => magneticDeclinationDeg({ latDeg, lonDeg, elevationM, date }))), { numRuns: 300 })
  })

  it('the building blocks, on wild numbers', () => {
    fc.assert(fc.property(wildValue, wildValue, wildValue, wildValue, (a, b, c, d) => {
      onlyOwnError(() => runwayComponents(a as number, b as number, c as number))
      onlyOwnError(() => pressureToHeightM(a as number))
      onlyOwnError(() => runwayTrueBearingDeg(a as number, b as number, c as number, d as number))
      onlyOwnError(() => magneticDeclinationDeg({ latDeg: a as number, lonDeg: b as number, elevationM: c as number, date: d as Date }))
      onlyOwnError(() => stormRelativeHelicity(a as number[], b as number[], c as number[], d as never))
      onlyOwnError(() => bunkersStormMotion(a as number[], b as number[], c as number[]))
    }), { numRuns: 1000 })
  })
})

import { describe, expect, it } from 'vitest'
import { WindValidationError, heightToPressureHpa, pressureToHeightM } from '../../../shared/wind'

// Published standard atmosphere table based on the 1964 ICAO table (per DOMAIN.md): whole metres.
const ICAO_TABLE: [pressureHpa: number, heightM: number, heightFt: number][] = [
  [1000, 111, 364],
  [850, 1457, 4781],
  [700, 3012, 9882],
  [500, 5574, 18289],
  [300, 9164, 30065],
]

describe('pressure to height, ICAO standard atmosphere (Doc 7488)', () => {
  for (const [p, m, ft] of ICAO_TABLE) {
    it(`${p} hPa is ${m} m / ${ft} ft (ICAO standard atmosphere table, rounded to the metre)`, () => {
      const h = pressureToHeightM(p)
      expect(Math.abs(h - m)).toBeLessThanOrEqual(0.5)
      expect(Math.abs(h / 0.3048 - ft)).toBeLessThanOrEqual(1)
    })
  }

  it('1013.25 hPa is sea level (ICAO standard atmosphere p0)', () => {
    expect(pressureToHeightM(1013.25)).toBeCloseTo(0, 9)
  })

  it('the 11 km tropopause is at 226.32 hPa (ICAO standard atmosphere, from memory) and the inverse round-trips', () => {
    expect(heightToPressureHpa(11000)).toBeCloseTo(226.32, 1)
    for (const h of [0, 500, 5000, 11000, 15000, 19999]) expect(pressureToHeightM(heightToPressureHpa(h))).toBeCloseTo(h, 6)
  })

  it('refuses a pressure of zero or less with its own error', () => {
    expect(() => pressureToHeightM(0)).toThrow(WindValidationError)
    expect(() => pressureToHeightM(-5)).toThrow(WindValidationError)
  })
})

import { describe, expect, it } from 'vitest'
import {
  formatCross, formatHeading, formatHeadTail, formatHeight, formatSpeed, headingFor, heightFromM, heightToM,
  M_PER_FT_EXACT, MPS_PER_KT_EXACT, speedFromKt, speedToKt,
} from '../../../shared/utils/display-units'

describe('display unit conversions', () => {
  it('uses the exact definitions: 1 kt = 1852/3600 m/s (international nautical mile, 1852 m), 1 ft = 0.3048 m (1959 agreement)', () => {
    expect(MPS_PER_KT_EXACT).toBe(1852 / 3600)
    expect(M_PER_FT_EXACT).toBe(0.3048)
    expect(speedFromKt(1, 'mps')).toBeCloseTo(0.514444, 6) // 1852/3600 = 0.514444… m/s
    expect(speedToKt(10, 'mps')).toBeCloseTo(19.438445, 6) // 10 / 0.514444… = 19.4384 kt
    expect(speedFromKt(25, 'kt')).toBe(25)
    expect(heightFromM(609.6, 'ft')).toBeCloseTo(2000, 9) // 2,000 ft = 609.6 m exactly (the TAF WS layer)
    expect(heightToM(100, 'ft')).toBeCloseTo(30.48, 9)
    expect(heightFromM(500, 'm')).toBe(500)
  })

  it('formats for reading: whole kt, m/s to one decimal, whole ft or m', () => {
    expect(formatSpeed(19.4384, 'kt')).toBe('19 kt')
    expect(formatSpeed(19.4384, 'mps')).toBe('10.0 m/s')
    expect(formatHeight(609.6, 'ft')).toBe('2000 ft')
    expect(formatHeight(30.48, 'm')).toBe('30 m')
    expect(formatSpeed(-0.2, 'kt', false)).toBe('0')
  })

  it('magnetic = true − east variation (FAA AIM convention); three digits, 360 for north', () => {
    expect(headingFor(47, 3.2, 'magnetic')).toBeCloseTo(43.8, 9)
    expect(headingFor(2, 5, 'magnetic')).toBeCloseTo(357, 9)
    expect(headingFor(358, -4, 'magnetic')).toBeCloseTo(2, 9)
    expect(formatHeading(47, 3.2, 'magnetic')).toBe('044°M')
    expect(formatHeading(0.2, 0, 'true')).toBe('360°T')
    expect(formatHeading(0, 0, 'true', true)).toBe('000')
  })

  it('says head or tail and the crosswind side in words (positive crosswind = from the right)', () => {
    // FAA crosswind chart example: runway 18, wind 220° at 30 kt: headwind 22.98 kt, crosswind 19.28 kt from the right.
    const theta = (220 - 180) * Math.PI / 180
    expect(formatHeadTail(30 * Math.cos(theta), 'kt')).toBe('23 kt headwind')
    expect(formatCross(30 * Math.sin(theta), 'kt')).toBe('19 kt from the right')
    expect(formatHeadTail(-4.4, 'kt')).toBe('4 kt tailwind')
    expect(formatCross(-7, 'mps')).toBe('3.6 m/s from the left')
  })
})

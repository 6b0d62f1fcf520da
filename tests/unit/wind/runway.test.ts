import { describe, expect, it } from 'vitest'
import {
  WindValidationError, designatorHeadingDeg, designatorMismatch, reciprocalHeadingDeg, runwayComponents,
} from '../../../shared/wind'

describe('runway components', () => {
  it('runway 18, wind 220° at 30 kt: headwind 22.98 kt, crosswind 19.28 kt from the right (FAA knowledge-test crosswind chart example; exact values V·cos40°, V·sin40°)', () => {
    const c = runwayComponents(220, 30, 180)
    expect(c.headwindKt).toBeCloseTo(22.98, 2)
    expect(c.crosswindKt).toBeCloseTo(19.28, 2)
    expect(c.crosswindSide).toBe('right')
  })

  it('the same wind on runway 36 is a 22.98 kt tailwind with the crosswind from the left (same chart example, other end)', () => {
    const c = runwayComponents(220, 30, 360)
    expect(c.headwindKt).toBeCloseTo(-22.98, 2)
    expect(c.crosswindKt).toBeCloseTo(-19.28, 2)
    expect(c.crosswindSide).toBe('left')
  })

  it('a wind straight down the runway has no crosswind side (definition: crosswind = V·sin θ)', () => {
    const c = runwayComponents(270, 15, 270)
    expect(c.headwindKt).toBeCloseTo(15, 12)
    expect(c.crosswindSide).toBe('none')
  })

  it('refuses non-numbers with its own error', () => {
    expect(() => runwayComponents(Number.NaN, 10, 180)).toThrow(WindValidationError)
  })
})

describe('designators (FAA AC 150/5340-1: magnetic azimuth / 10, rounded)', () => {
  it('reads designators with and without a side letter', () => {
    expect(designatorHeadingDeg('09L')).toBe(90)
    expect(designatorHeadingDeg('36')).toBe(360)
    expect(designatorHeadingDeg('37')).toBeNull()
    expect(designatorHeadingDeg('00')).toBeNull()
  })

  it('reports more than 10° between designator and magnetic heading, not 10° or less (product rule, issue 3)', () => {
    expect(designatorMismatch('18', 191).mismatch).toBe(true)
    expect(designatorMismatch('18', 190).mismatch).toBe(false)
    expect(designatorMismatch('01', 355)).toEqual({ designatorHeadingDeg: 10, differenceDeg: 15, mismatch: true })
    expect(designatorMismatch('36', 4).differenceDeg).toBeCloseTo(4, 12)
  })

  it('refuses a designator that is not one', () => {
    expect(() => designatorMismatch('XYZ', 100)).toThrow(WindValidationError)
  })

  it('the reciprocal of 041.3 is 221.3 and of 180 is 360', () => {
    expect(reciprocalHeadingDeg(41.3)).toBeCloseTo(221.3, 10)
    expect(reciprocalHeadingDeg(180)).toBe(360)
  })
})

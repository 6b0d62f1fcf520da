import { describe, expect, it } from 'vitest'
import { labelledLevelIndices, polarXY, ringSpeeds } from '../../../utils/polar-geometry'

describe('polar geometry', () => {
  it('draws bearings clockwise from north with north up (screen y grows downward)', () => {
    const n = polarXY(0, 100, 0, 0)
    const e = polarXY(90, 100, 0, 0)
    const sw = polarXY(225, 100, 0, 0)
    expect(n.x).toBeCloseTo(0, 9)
    expect(n.y).toBeCloseTo(-100, 9)
    expect(e.x).toBeCloseTo(100, 9)
    expect(sw.x).toBeCloseTo(-70.7107, 4) // 100·sin 225° = −70.7107
    expect(sw.y).toBeCloseTo(70.7107, 4)
  })

  it('rings are round values that reach the strongest wind', () => {
    expect(ringSpeeds(42)).toEqual([10, 20, 30, 40, 50])
    expect(ringSpeeds(3)).toEqual([1, 2, 3, 4, 5])
    expect(ringSpeeds(70)[ringSpeeds(70).length - 1]).toBeGreaterThanOrEqual(70)
  })

  it('labels the lowest and highest level and the ones nearest 300 and 600 m', () => {
    expect(labelledLevelIndices([10, 60, 120, 200, 300, 400, 500, 600, 800])).toEqual([0, 4, 7, 8])
    expect(labelledLevelIndices([])).toEqual([])
  })
})

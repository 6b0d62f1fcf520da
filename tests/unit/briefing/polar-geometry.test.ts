import { describe, expect, it } from 'vitest'
import { labelledLevelIndices, placeLabels, polarXY, ringSpeeds } from '../../../utils/polar-geometry'

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

describe('height labels that never overlap', () => {
  const box = (p: { x: number, y: number, anchor: 'start' | 'end' }, text: string) => {
    const w = text.length * 6.2
    return { x: p.anchor === 'start' ? p.x : p.x - w, y: p.y - 11, w, h: 11 }
  }
  it('keeps every placed label clear of the others, thinning the ones with no free place', () => {
    // Ten points bunched within 20 px (a calm profile): not all can carry a label.
    const items = Array.from({ length: 10 }, (_, i) => ({ index: i, x: 150 + i * 2, y: 150 + i * 2, text: `${(i + 1) * 100} ft` }))
    const placed = placeLabels(items, 360)
    expect(placed.length).toBeGreaterThan(0)
    expect(placed.length).toBeLessThan(items.length)
    const boxes = placed.map(p => box(p, items[p.index]!.text))
    for (let a = 0; a < boxes.length; a++) {
      for (let b = a + 1; b < boxes.length; b++) {
        const A = boxes[a]!
        const B = boxes[b]!
        const apart = A.x + A.w <= B.x || B.x + B.w <= A.x || A.y + A.h <= B.y || B.y + B.h <= A.y
        expect(apart, `${placed[a]!.index} and ${placed[b]!.index}`).toBe(true)
      }
    }
    // The first candidate (the lowest level) always gets its place when there is room.
    expect(placed[0]!.index).toBe(0)
  })
  it('labels far apart are all kept, inside the figure', () => {
    const items = [{ index: 0, x: 20, y: 20, text: 'SFC' }, { index: 1, x: 340, y: 340, text: '2000 ft' }]
    const placed = placeLabels(items, 360)
    expect(placed.map(p => p.index)).toEqual([0, 1])
    for (const p of placed) {
      const b = box(p, items[p.index]!.text)
      expect(b.x).toBeGreaterThanOrEqual(0)
      expect(b.x + b.w).toBeLessThanOrEqual(360)
    }
  })
})

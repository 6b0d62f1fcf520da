// The two in-memory caches: the analysis cache's bounds and the session cache's lifetime (a clock passed in, no waiting).
import { describe, expect, it } from 'vitest'
import { BoundedCache } from '../../../server/domain/briefings/analysis-cache'
import { ShortSessionCache } from '../../../server/domain/accounts/session-cache'
import { displayLevelIndexes, roundFigures, roundTo } from '../../../server/domain/briefings/precision'

describe('BoundedCache', () => {
  it('keeps at most its entries and bytes, dropping the least recently used first', () => {
    const c = new BoundedCache<{ bytes: number, v: string }>(3, 100)
    c.set('a', { bytes: 10, v: 'a' })
    c.set('b', { bytes: 10, v: 'b' })
    c.set('c', { bytes: 10, v: 'c' })
    expect(c.get('a')?.v).toBe('a') // a is now the most recent
    c.set('d', { bytes: 10, v: 'd' })
    expect(c.get('b')).toBeUndefined()
    expect([c.get('a')?.v, c.get('c')?.v, c.get('d')?.v]).toEqual(['a', 'c', 'd'])
    c.set('big', { bytes: 90, v: 'big' })
    expect(c.totalBytes).toBeLessThanOrEqual(100)
    expect(c.get('big')?.v).toBe('big')
    c.set('huge', { bytes: 101, v: 'x' })
    expect(c.get('huge')).toBeUndefined()
  })
})

describe('ShortSessionCache', () => {
  it('forgets an entry after its lifetime and at once when the user changes', () => {
    const c = new ShortSessionCache<string>(1000, 2)
    c.set('s1', 7, 'pilot', 0)
    expect(c.get('s1', 999)).toBe('pilot')
    expect(c.get('s1', 1000)).toBeUndefined()
    c.set('s1', 7, 'pilot', 2000)
    c.set('s2', 7, 'pilot', 2000)
    c.forgetUser(7)
    expect(c.get('s1', 2001)).toBeUndefined()
    expect(c.get('s2', 2001)).toBeUndefined()
    c.set('a', 1, 'x', 0)
    c.set('b', 2, 'y', 0)
    c.set('c', 3, 'z', 0)
    expect(c.size).toBe(2)
    expect(c.get('a', 1)).toBeUndefined()
  })

  it('never keeps anything longer than one second, whatever it is asked', () => {
    const c = new ShortSessionCache<string>(0)
    c.set('s', 1, 'v', 0)
    expect(c.get('s', 0)).toBeUndefined()
  })
})

describe('trade precision', () => {
  it('rounds by the unit in the field name and by a check\'s unit', () => {
    // Steps as documented in README (Briefings, API): 0.1 kt, 0.1 m, 0.01 kt/100 ft, 0.1°, 1e-6° for coordinates.
    expect(roundFigures({ headwindKt: 12.345, heightAglM: 30.04999, shearKtPer100ft: 3.14159, directionDeg: 359.96,
      latitudeDeg: 46.12345678, srh0to1kmM2s2: 123.6, sourceIndex: 7, rank: 2 }))
      .toEqual({ headwindKt: 12.3, heightAglM: 30, shearKtPer100ft: 3.14, directionDeg: 360, latitudeDeg: 46.123457,
        srh0to1kmM2s2: 124, sourceIndex: 7, rank: 2 })
    expect(roundFigures({ unit: 'kt/100 ft', value: 4.567, limit: 4, excess: 0.567 })).toEqual({ unit: 'kt/100 ft', value: 4.57, limit: 4, excess: 0.57 })
    expect(roundFigures({ unit: 'kt', value: 21.25, limit: 20, excess: 1.25 })).toEqual({ unit: 'kt', value: 21.3, limit: 20, excess: 1.3 })
    expect(roundTo(-0.04, 0.1)).toBe(0)
  })

  it('shows every level of a small profile and at most 120 of a deep one, the ends among them', () => {
    expect(displayLevelIndexes([10, 60, 120])).toEqual([0, 1, 2])
    const deep = Array.from({ length: 5000 }, (_, i) => 10 + i * 2)
    const shown = displayLevelIndexes(deep)
    expect(shown.length).toBeLessThanOrEqual(120)
    expect(shown[0]).toBe(0)
    expect(shown.at(-1)).toBe(4999)
    expect(shown.filter(i => deep[i]! <= 600).length).toBeLessThanOrEqual(80)
    expect([...shown].sort((a, b) => a - b)).toEqual(shown)
  })
})

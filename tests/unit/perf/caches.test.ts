// The analysis cache's bounds, the trade precision, and the shared reads that let requests arriving together share one query.
import { describe, expect, it } from 'vitest'
import { BoundedCache } from '../../../server/domain/briefings/analysis-cache'
import { displayLevelIndexes, roundFigures, roundTo } from '../../../server/domain/briefings/precision'
import { sharedRead, sharedReadsWaiting } from '../../../server/utils/shared-read'
import { acceptsGzip } from '../../../server/utils/json-text'
import { KeptAnswers, nextChangeMs, pageCountersOf } from '../../../server/domain/airfields/versions'

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

describe('sharedRead', () => {
  it('gives the requests that arrive together one read, and a request arriving once a read has begun a new one', async () => {
    const begun: number[] = []
    const finish: Array<(v: string) => void> = []
    const read = () => {
      begun.push(begun.length + 1)
      return new Promise<string>(resolve => finish.push(resolve))
    }
    const a = sharedRead('k', read)
    const b = sharedRead('k', read)
    const other = sharedRead('other', async () => 'other')
    expect(sharedReadsWaiting()).toBe(2)
    expect(begun).toEqual([]) // nothing starts before the turn ends: whoever comes in this turn joins
    await new Promise(r => setImmediate(r))
    expect(begun).toEqual([1])
    // The first read is under way: a request now must not take its answer (it may predate a change this one follows).
    const c = sharedRead('k', read)
    await new Promise(r => setImmediate(r))
    expect(begun).toEqual([1, 2])
    finish[0]!('first')
    finish[1]!('second')
    expect(await a).toBe('first')
    expect(await b).toBe('first')
    expect(await c).toBe('second')
    expect(await other).toBe('other')
    expect(sharedReadsWaiting()).toBe(0)
  })

  it('hands a failed read\'s error to each request that shared it, and the next request reads afresh', async () => {
    const failing = () => Promise.reject(new Error('database away'))
    const x = sharedRead('f', failing)
    const y = sharedRead('f', failing)
    await expect(x).rejects.toThrow('database away')
    await expect(y).rejects.toThrow('database away')
    expect(await sharedRead('f', async () => 'back')).toBe('back')
  })
})

describe('acceptsGzip', () => {
  it('reads Accept-Encoding as RFC 9110 §12.5.3 does, on its own examples', () => {
    // The examples of RFC 9110 §12.5.3, and what a browser sends.
    expect(acceptsGzip('compress, gzip')).toBe(true)
    expect(acceptsGzip('')).toBe(false) // empty: identity only
    expect(acceptsGzip('*')).toBe(true)
    expect(acceptsGzip('compress;q=0.5, gzip;q=1.0')).toBe(true)
    expect(acceptsGzip('gzip;q=1.0, identity; q=0.5, *;q=0')).toBe(true)
    expect(acceptsGzip('gzip, deflate, br, zstd')).toBe(true)
    // A weight of 0 means "not acceptable"; an explicit gzip;q=0 wins over "*".
    expect(acceptsGzip('gzip;q=0')).toBe(false)
    expect(acceptsGzip('gzip;q=0, *')).toBe(false)
    expect(acceptsGzip('identity, *;q=0')).toBe(false)
    expect(acceptsGzip('br')).toBe(false)
    expect(acceptsGzip(undefined)).toBe(false)
  })
})

describe('kept answers', () => {
  const now = new Date('2026-12-02T12:00:00Z')
  it('run out at the earliest instant still to come, and never for instants past or missing', () => {
    const at = (iso: string) => new Date(iso)
    expect(nextChangeMs(now, at('2026-12-02T15:00:00Z'), at('2026-12-02T13:30:00Z'), null, undefined))
      .toBe(Date.parse('2026-12-02T13:30:00Z'))
    expect(nextChangeMs(now, at('2026-12-02T11:00:00Z'), now)).toBe(Number.POSITIVE_INFINITY)
  })

  it('are served only at the counters they were read at and before they run out', () => {
    const kept = new KeptAnswers<string>(10)
    const page = { set: 5, follow: 2, org: 2, rows: [{ id: 7, v: 3 }, { id: 9, v: 1 }] }
    const counters = pageCountersOf(page)
    expect(counters).toBe('5|2|2|7:3,9:1')
    kept.set('page', 'answer', counters, now.getTime() + 60_000, 100, [7, 9])
    expect(kept.has('page')).toBe(true)
    expect(kept.idsOf('page')).toEqual([7, 9])
    expect(kept.get('page', counters, now)).toBe('answer')
    // One airfield's counter moved, the order changed, an airfield was added or renamed, the reader's follows or the
    // organisation's limits changed: not served.
    expect(kept.get('page', pageCountersOf({ ...page, rows: [{ id: 7, v: 4 }, { id: 9, v: 1 }] }), now)).toBeUndefined()
    expect(kept.get('page', pageCountersOf({ ...page, rows: [{ id: 9, v: 1 }, { id: 7, v: 3 }] }), now)).toBeUndefined()
    expect(kept.get('page', pageCountersOf({ ...page, set: 6 }), now)).toBeUndefined()
    expect(kept.get('page', pageCountersOf({ ...page, follow: 3 }), now)).toBeUndefined()
    expect(kept.get('page', pageCountersOf({ ...page, org: 3 }), now)).toBeUndefined()
    // Counters read as text or as numbers are the same counters.
    expect(kept.get('page', pageCountersOf({ set: '5', follow: '2', org: '2', rows: [{ id: 7, v: '3' }, { id: 9, v: '1' }] }), now)).toBe('answer')
    // Its time-bound content ran out.
    expect(kept.get('page', counters, new Date(now.getTime() + 60_000))).toBeUndefined()
  })

  it('stands with no query only at the very read stamp it was confirmed at, and never past its time', () => {
    const kept = new KeptAnswers<string>(10)
    const now = new Date('2026-12-03T12:00:00Z')
    const until = now.getTime() + 60_000
    kept.set('b', 'read at 41', '7|2', until, 100, [], '41')
    expect(kept.confirmed('b', '41', now)).toBe('read at 41')
    // Any change anywhere since moves the data counter: the answer must be checked by its own counters again.
    expect(kept.confirmed('b', '42', now)).toBeUndefined()
    // No stamp (no session read vouches for anything): never without a check.
    expect(kept.confirmed('b', null, now)).toBeUndefined()
    // Found standing by its counters at a later stamp: confirmed there, with the value as read then.
    expect(kept.get('b', '7|2', now)).toBe('read at 41')
    kept.confirm('b', '42', 'checked at 42')
    expect(kept.confirmed('b', '42', now)).toBe('checked at 42')
    expect(kept.confirmed('b', '41', now)).toBeUndefined()
    expect(kept.confirmed('b', '42', new Date(until))).toBeUndefined()
    // Kept without a stamp: nothing to confirm at.
    kept.set('c', 'no stamp', '1|1', until, 100)
    expect(kept.confirmed('c', '42', now)).toBeUndefined()
    kept.confirm('missing', '42')
    expect(kept.confirmed('missing', '42', now)).toBeUndefined()
  })
})

import { describe, expect, it } from 'vitest'
import { covers, inForceAt, inForceFrom, mergeIntervals, planSupersession, supersededAt, type ProfileSpan } from '../../server/domain/profiles/supersession'

// Product rule (issue 11): a new profile supersedes an active one only for the time they share.
const h = (hour: number) => new Date(Date.UTC(2026, 2, 1, hour))
const span = (id: number, from: number, to: number, superseded: [number, number][] = []): ProfileSpan =>
  ({ id, validFrom: h(from), validTo: h(to), superseded: superseded.map(([a, b]) => ({ from: h(a), to: h(b) })) })

describe('supersession by time', () => {
  it('a later profile overlapping 06-09 with 08-11 supersedes only 08-09; the older stays in force 06-08', () => {
    const plan = planSupersession(h(8), h(11), [span(1, 6, 9)], h(5))
    expect(plan.records).toEqual([{ profileId: 1, fromAt: h(8), toAt: h(9) }])
    expect(plan.partlySuperseded).toEqual([1])
    expect(plan.fullySuperseded).toEqual([])
    const older = span(1, 6, 9, [[8, 9]])
    expect(inForceAt(older, h(7))).toBe(true)
    expect(inForceAt(older, h(8))).toBe(false)
  })

  it('a profile covering the whole validity supersedes it fully; two partial ones together do too', () => {
    expect(planSupersession(h(5), h(10), [span(1, 6, 9)], h(5)).fullySuperseded).toEqual([1])
    expect(planSupersession(h(7), h(12), [span(1, 6, 9, [[5, 7]])], h(5)).fullySuperseded).toEqual([1])
    expect(planSupersession(h(8), h(12), [span(1, 6, 9, [[5, 7]])], h(5)).partlySuperseded).toEqual([1])
  })

  it('only what is still ahead counts: 06-09 overlapped from 06:30 by a filing made at 06:45 is wholly superseded', () => {
    // The minutes 06:00-06:30 are past: the older profile was in force then, and nothing of it is left from 06:45 on.
    const halfPast = new Date(h(6).getTime() + 30 * 60_000)
    const quarterTo = new Date(h(6).getTime() + 45 * 60_000)
    const plan = planSupersession(halfPast, h(11), [span(1, 6, 9)], quarterTo)
    expect(plan.records).toEqual([{ profileId: 1, fromAt: halfPast, toAt: h(9) }])
    expect(plan.fullySuperseded).toEqual([1])
    // Filed at 05:00 instead, 06:00-06:30 is still ahead: the older one stays in force for it.
    expect(planSupersession(halfPast, h(11), [span(1, 6, 9)], h(5)).partlySuperseded).toEqual([1])
    // A profile wholly in the past counts as superseded only when all of its validity is covered.
    expect(inForceFrom(span(1, 6, 9, [[7, 9]]), h(12))).toBe(true)
    expect(inForceFrom(span(1, 6, 9, [[6, 9]]), h(12))).toBe(false)
  })

  it('the interval covering a moment names the newest profile that took it over', () => {
    const p = { superseded: [{ from: h(6), to: h(9), byId: 4 }, { from: h(7), to: h(8), byId: 7 }] }
    expect(supersededAt(p, h(7))?.byId).toBe(7)
    expect(supersededAt(p, h(8))?.byId).toBe(4)
    expect(supersededAt(p, h(9))).toBeNull()
  })

  it('intervals merge and cover without gaps, touching ends joining (half-open intervals)', () => {
    expect(mergeIntervals([{ from: h(3), to: h(4) }, { from: h(1), to: h(3) }]).map(i => [i.from, i.to])).toEqual([[h(1), h(4)]])
    expect(covers([{ from: h(1), to: h(2) }, { from: h(2), to: h(4) }], h(1), h(4))).toBe(true)
    expect(covers([{ from: h(1), to: h(2) }, { from: h(3), to: h(4) }], h(1), h(4))).toBe(false)
  })

  it('20 shifted windows filed one after another leave exactly one profile in force at every 5-minute slot', () => {
    const filed: ProfileSpan[] = []
    for (let k = 0; k < 20; k++) {
      const from = new Date(h(0).getTime() + k * 15 * 60_000)
      const to = new Date(from.getTime() + 90 * 60_000)
      const overlapping = filed.filter(p => p.validFrom < to && p.validTo > from && !covers(p.superseded, p.validFrom, p.validTo))
      const plan = planSupersession(from, to, overlapping, h(0))
      for (const r of plan.records) filed.find(p => p.id === r.profileId)!.superseded.push({ from: r.fromAt, to: r.toAt })
      filed.push({ id: k + 1, validFrom: from, validTo: to, superseded: [] })
    }
    const end = filed[19]!.validTo.getTime()
    for (let at = h(0).getTime() + 150_000; at < end; at += 300_000) {
      const inForce = filed.filter(p => inForceAt(p, new Date(at)))
      expect(inForce).toHaveLength(1)
      // the newest filed for that moment
      const newest = Math.max(...filed.filter(p => p.validFrom.getTime() <= at && at < p.validTo.getTime()).map(p => p.id))
      expect(inForce[0]!.id).toBe(newest)
    }
  })
})

import { describe, expect, it } from 'vitest'
import { spreadLabels, trendPanel } from '../../../utils/trend-geometry'

// Layout rules of the day's trend chart (drawing geometry, not wind figures).
const times = ['2026-12-02T00:30:00Z', '2026-12-02T06:00:00Z', '2026-12-02T12:00:00Z', '2026-12-02T18:00:00Z']

describe('trend chart geometry', () => {
  it('the y-axis reaches above every value and every limit, so nothing is drawn off the top', () => {
    const p = trendPanel({
      date: '2026-12-02', times, widthPx: 390, heightPx: 190,
      lines: [{ name: 'crosswind', values: [4, 31.4, 12, null], cls: '', textCls: '', dash: '', decimals: 0 }],
      limits: [{ name: 'crosswind limit', value: 25 }, { name: 'tailwind limit', value: null }],
    })
    expect(p.yMax).toBeGreaterThanOrEqual(31.4)
    for (const ln of p.lines) {
      for (const m of ln.d.matchAll(/[ML,]?([\d.]+),([\d.]+)/g)) {
        expect(Number(m[2])).toBeGreaterThanOrEqual(p.plot.top - 0.001)
        expect(Number(m[2])).toBeLessThanOrEqual(p.plot.bottom + 0.001)
      }
    }
    expect(p.limits.map(l => l.name)).toEqual(['crosswind limit']) // a limit not set is not drawn as 0
    expect(p.labels[0]).toMatchObject({ name: 'crosswind', lastValue: '12' })
  })

  it('uses fewer hour ticks on a phone than on a desk', () => {
    const base = { date: '2026-12-02', times, heightPx: 190, lines: [], limits: [] }
    expect(trendPanel({ ...base, widthPx: 390 }).xTicks.length).toBeLessThan(trendPanel({ ...base, widthPx: 1200 }).xTicks.length)
  })

  it('spreads line labels that would overlap and keeps them inside the plot', () => {
    const ys = spreadLabels([100, 102, 101], 10, 150, 14)
    const sorted = [...ys].sort((a, b) => a - b)
    expect(sorted[1]! - sorted[0]!).toBeGreaterThanOrEqual(14)
    expect(sorted[2]! - sorted[1]!).toBeGreaterThanOrEqual(14)
    const low = spreadLabels([149, 150], 10, 150, 14)
    expect(Math.max(...low)).toBeLessThanOrEqual(150)
    expect(Math.abs(low[0]! - low[1]!)).toBeGreaterThanOrEqual(14)
  })
})

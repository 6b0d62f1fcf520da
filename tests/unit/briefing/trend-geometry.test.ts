import { describe, expect, it } from 'vitest'
import { scaleLinear, scaleUtc } from 'd3-scale'
import { spreadLabels, trendPanel } from '../../../utils/trend-geometry'
import { linearScale } from '../../../utils/polar-geometry'

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

  it('places ticks and points where d3-scale\'s time and linear scales put them (d3-scale 4 as the reference)', () => {
    const lines = [{ name: 'shear', values: [1.2, 3.37, 2.5, 0.4], cls: '', textCls: '', dash: '', decimals: 2 }]
    for (const widthPx of [390, 1200]) {
      const p = trendPanel({ date: '2026-12-02', times, widthPx, heightPx: 190, lines, limits: [{ name: 'shear limit', value: 4 }] })
      const x = scaleUtc().domain([new Date('2026-12-02T00:00:00Z'), new Date('2026-12-03T00:00:00Z')]).range([p.plot.left, p.plot.right])
      const y = scaleLinear().domain([0, 4 * 1.12]).range([p.plot.bottom, p.plot.top]).nice()
      const d3x = x.ticks(widthPx < 600 ? 4 : 8)
      expect(p.xTicks.map(t => t.label)).toEqual(d3x.map(t => `${t.toISOString().slice(11, 13)}Z`))
      p.xTicks.forEach((t, i) => expect(t.x).toBeCloseTo(x(d3x[i]!), 9))
      expect(p.yMax).toBe(y.domain()[1])
      expect(p.yTicks.map(t => t.value)).toEqual(y.ticks(4))
      p.yTicks.forEach(t => expect(t.y).toBeCloseTo(y(t.value), 9))
      expect(p.lines[0]!.last!.y).toBeCloseTo(y(0.4), 9)
      expect(p.lines[0]!.last!.x).toBeCloseTo(x(new Date(times[3]!)), 9)
    }
    const f = linearScale(0, 40, 0, 136)
    const g = scaleLinear().domain([0, 40]).range([0, 136])
    for (const v of [0, 7.3, 19.4, 40, 52]) expect(f(v)).toBeCloseTo(g(v), 12)
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

import { line } from 'd3-shape'
import { nice, ticks } from 'd3-array'
import { linearScale } from './polar-geometry'

// Geometry of one panel of the day's trend chart, in the SVG's own pixels (no framework inside).

export interface TrendLine {
  name: string
  values: (number | null)[]
  cls: string
  textCls: string
  dash: string
  /** Decimals of the value printed beside the line's name. */
  decimals: number
}

export interface TrendPanelInput {
  date: string
  times: string[]
  widthPx: number
  heightPx: number
  lines: TrendLine[]
  limits: { name: string, value: number | null }[]
}

const LABEL_GAP_PX = 14

/** Spread labels apart vertically so no two overlap, keeping them inside [top, bottom]. */
export function spreadLabels(ys: number[], top: number, bottom: number, gapPx = LABEL_GAP_PX): number[] {
  const order = ys.map((y, i) => ({ y, i })).sort((a, b) => a.y - b.y)
  const placed: number[] = []
  for (const o of order) {
    const prev = placed.length ? placed[placed.length - 1]! : -Infinity
    placed.push(Math.max(o.y, prev + gapPx, top))
  }
  // Pushed past the bottom: shift the whole stack up.
  const over = (placed[placed.length - 1] ?? bottom) - bottom
  if (over > 0) for (let k = 0; k < placed.length; k++) placed[k] = placed[k]! - over
  const out = new Array<number>(ys.length)
  order.forEach((o, k) => {
    out[o.i] = placed[k]!
  })
  return out
}

export function trendPanel(input: TrendPanelInput) {
  const { widthPx, heightPx } = input
  const narrow = widthPx < 600
  const plot = { left: 34, right: widthPx - (narrow ? 8 : 12), top: 16, bottom: heightPx - 22 }
  // Linear maps and round ticks from d3-array: d3-scale would bring its interpolators, colours and time formats
  // into the briefing page's first load for what these lines do (checked against d3-scale in the unit tests).
  const dayStartMs = Date.parse(`${input.date}T00:00:00Z`)
  const toX = linearScale(dayStartMs, dayStartMs + 24 * 3600_000, plot.left, plot.right)
  const x = (t: Date) => toX(t.getTime())
  const finite = (v: number | null | undefined): v is number => v != null && Number.isFinite(v)
  const limitValues = input.limits.map(l => l.value).filter(finite)
  const dataValues = input.lines.flatMap(l => l.values).filter(finite)
  // The axis fits every line and every limit with room for a label above the highest.
  const top = Math.max(1, ...dataValues, ...limitValues) * 1.12
  const yTop = nice(0, top, 10)[1]
  const y = linearScale(0, yTop, plot.bottom, plot.top)
  // Every 3 hours on a desk, every 6 on a phone (the UTC hours d3's time scale picks for 8 and 4 ticks a day).
  const stepH = narrow ? 6 : 3
  const xTicks = Array.from({ length: 24 / stepH + 1 }, (_, k) => new Date(dayStartMs + k * stepH * 3600_000))
    .map(t => ({ x: x(t), label: `${t.toISOString().slice(11, 13)}Z` }))
  const yTicks = ticks(0, yTop, 4).map(v => ({ value: v, y: y(v) }))
  const stamps = input.times.map(t => new Date(t))

  const lines = input.lines.map((ln) => {
    const pts = stamps.map((t, i) => ({ t, v: ln.values[i] })).filter((d): d is { t: Date, v: number } => finite(d.v))
    const d = line<{ t: Date, v: number }>().x(p => x(p.t)).y(p => y(p.v))(pts) ?? ''
    const last = pts[pts.length - 1]
    return { ...ln, d, last: last ? { x: x(last.t), y: y(last.v), v: last.v } : null }
  })
  const withLast = lines.filter(l => l.last)
  const labelYs = spreadLabels(withLast.map(l => l.last!.y - 6), plot.top + 10, plot.bottom - 2)
  const labels = withLast.map((l, k) => ({
    name: l.name,
    textCls: l.textCls,
    lastValue: l.last!.v.toFixed(l.decimals),
    x: Math.min(plot.right - 2, Math.max(plot.left + 90, l.last!.x - 4)),
    y: labelYs[k]!,
  }))
  const limits = input.limits
    .filter((l): l is { name: string, value: number } => finite(l.value))
    .map(l => ({ name: l.name, value: l.value, y: y(l.value) }))
  const limitLabelYs = spreadLabels(limits.map(l => l.y - 4), plot.top + 8, plot.bottom - 2, 13)
  return {
    plot,
    xTicks,
    yTicks,
    lines,
    labels,
    limits: limits.map((l, k) => ({ ...l, labelY: limitLabelYs[k]! })),
    yMax: yTop,
  }
}

// Geometry of the polar wind display: plain functions, unit-tested.
import { ticks } from 'd3-array'

/** Screen point of a bearing (degrees clockwise from north, drawn with north up) at radius r from (cx, cy). */
export function polarXY(bearingDeg: number, r: number, cx: number, cy: number) {
  const a = (bearingDeg * Math.PI) / 180
  return { x: cx + r * Math.sin(a), y: cy - r * Math.cos(a) }
}

/**
 * A linear map from [d0, d1] to [r0, r1] (what d3-scale's scaleLinear does for these displays, without pulling its
 * interpolators, colours and number formats into the page's first load).
 */
export function linearScale(d0: number, d1: number, r0: number, r1: number): (x: number) => number {
  const k = d1 === d0 ? 0 : (r1 - r0) / (d1 - d0)
  return (x: number) => r0 + (x - d0) * k
}

/** Speed rings: nice round values (d3 ticks) from above zero up to at least `maxSpeed`, at least one ring. */
export function ringSpeeds(maxSpeed: number): number[] {
  const top = Math.max(maxSpeed, 5)
  const t = ticks(0, top, 4).filter(v => v > 0)
  const step = t.length > 1 ? t[1]! - t[0]! : t[0] ?? top
  while (t.length === 0 || t[t.length - 1]! < top - 1e-9) t.push((t[t.length - 1] ?? 0) + step)
  return t
}

/** Which levels carry a height label: the lowest, the highest, and the level nearest each chosen height. */
export function labelledLevelIndices(heightsM: number[], chosenM = [300, 600, 3000, 6000]): number[] {
  if (!heightsM.length) return []
  const picks = new Set<number>([0, heightsM.length - 1])
  const top = heightsM[heightsM.length - 1]!
  for (const target of chosenM) {
    if (target > top + 50) continue
    let best = 0
    for (let i = 1; i < heightsM.length; i++) {
      if (Math.abs(heightsM[i]! - target) < Math.abs(heightsM[best]! - target)) best = i
    }
    picks.add(best)
  }
  return [...picks].sort((a, b) => a - b)
}

export const COMPASS_POINTS = [
  { label: 'N', bearingDeg: 0 }, { label: 'E', bearingDeg: 90 }, { label: 'S', bearingDeg: 180 }, { label: 'W', bearingDeg: 270 },
] as const

/** The heights (metres) worth a label on a wind display, by the reader's unit: round values of that unit. */
export function labelHeightsM(unit: 'ft' | 'm'): number[] {
  return unit === 'ft'
    ? [500, 1000, 2000, 5000, 10000, 20000].map(ft => ft * 0.3048)
    : [150, 300, 600, 1000, 3000, 6000]
}

export type LabelBox = { x: number, y: number, w: number, h: number }
export type PlacedLabel = { index: number, x: number, y: number, anchor: 'start' | 'end' }

const overlaps = (a: LabelBox, b: LabelBox, gap: number) =>
  a.x < b.x + b.w + gap && b.x < a.x + a.w + gap && a.y < b.y + b.h + gap && b.y < a.y + a.h + gap

/**
 * Height labels that never overlap: each candidate (in priority order) tries four places around its point (right
 * above, right below, left above, left below) and takes the first that stays inside the figure and clear of every
 * label already placed and of the other labelled points; a candidate with no free place is left out (thinned).
 * `charWidthPx` and `heightPx` size a label's box from its text.
 */
export function placeLabels(items: { index: number, x: number, y: number, text: string }[], size: number,
  charWidthPx = 6.2, heightPx = 11, gapPx = 2, pointRadiusPx = 5): PlacedLabel[] {
  const placed: (PlacedLabel & { box: LabelBox })[] = []
  const points: LabelBox[] = items.map(p => ({ x: p.x - pointRadiusPx, y: p.y - pointRadiusPx, w: 2 * pointRadiusPx, h: 2 * pointRadiusPx }))
  for (const [k, it] of items.entries()) {
    const w = it.text.length * charWidthPx
    const tries: { box: LabelBox, anchor: 'start' | 'end', tx: number, ty: number }[] = [
      { box: { x: it.x + 7, y: it.y - 6 - heightPx, w, h: heightPx }, anchor: 'start', tx: it.x + 7, ty: it.y - 7 },
      { box: { x: it.x + 7, y: it.y + 6, w, h: heightPx }, anchor: 'start', tx: it.x + 7, ty: it.y + 5 + heightPx },
      { box: { x: it.x - 7 - w, y: it.y - 6 - heightPx, w, h: heightPx }, anchor: 'end', tx: it.x - 7, ty: it.y - 7 },
      { box: { x: it.x - 7 - w, y: it.y + 6, w, h: heightPx }, anchor: 'end', tx: it.x - 7, ty: it.y + 5 + heightPx },
    ]
    const ok = tries.find(t => t.box.x >= 0 && t.box.y >= 0 && t.box.x + t.box.w <= size && t.box.y + t.box.h <= size
      && placed.every(p => !overlaps(p.box, t.box, gapPx))
      && points.every((pt, j) => j === k || !overlaps(pt, t.box, 0)))
    if (ok) placed.push({ index: it.index, x: ok.tx, y: ok.ty, anchor: ok.anchor, box: ok.box })
  }
  return placed.map(({ box: _b, ...p }) => p)
}

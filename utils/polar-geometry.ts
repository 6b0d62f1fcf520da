// Geometry of the polar wind display: plain functions, unit-tested.
import { ticks } from 'd3-array'

/** Screen point of a bearing (degrees clockwise from north, drawn with north up) at radius r from (cx, cy). */
export function polarXY(bearingDeg: number, r: number, cx: number, cy: number) {
  const a = (bearingDeg * Math.PI) / 180
  return { x: cx + r * Math.sin(a), y: cy - r * Math.cos(a) }
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

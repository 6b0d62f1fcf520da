import { uvToWind } from './vector'
import type { NormalisedLevel } from './types'

/** The wind at one height between filed levels, in the engine's way: linear in u and v (as its 0-600 m grid). */
export interface WindAtHeight {
  heightAglM: number
  uKt: number
  vKt: number
  speedKt: number
  /** 0 for calm, otherwise (0, 360], the direction the wind blows FROM (true). */
  directionDeg: number
  /** True when `heightAglM` is a filed level (no interpolation). */
  filed: boolean
}

// Heights closer than this are the same height (the engine's SAME_POINT_M).
const SAME_M = 1e-6

/**
 * Wind at `heightAglM` from normalised levels sorted by height, linear in u and v between the two levels around it;
 * null outside the profile (nothing is extrapolated).
 */
export function windAtHeightAglM(levels: readonly NormalisedLevel[], heightAglM: number): WindAtHeight | null {
  const n = levels.length
  if (!n || !Number.isFinite(heightAglM)) return null
  if (heightAglM < levels[0]!.heightAglM - SAME_M || heightAglM > levels[n - 1]!.heightAglM + SAME_M) return null
  for (let i = 0; i < n; i++) {
    const b = levels[i]!
    if (Math.abs(b.heightAglM - heightAglM) <= SAME_M) {
      return { heightAglM, uKt: b.uKt, vKt: b.vKt, speedKt: b.speedKt, directionDeg: b.directionDeg, filed: true }
    }
    if (b.heightAglM > heightAglM) {
      const a = levels[i - 1]!
      const t = (heightAglM - a.heightAglM) / (b.heightAglM - a.heightAglM)
      const uKt = a.uKt + t * (b.uKt - a.uKt)
      const vKt = a.vKt + t * (b.vKt - a.vKt)
      const w = uvToWind(uKt, vKt)
      return { heightAglM, uKt, vKt, speedKt: w.speed, directionDeg: w.directionDeg, filed: false }
    }
  }
  return null
}

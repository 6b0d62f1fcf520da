import { MPS_PER_KT } from '../units'
import type { FFactorResult, GridPoint } from './types'

/** Standard gravity, m/s² (ICAO Doc 7488 / CGPM 1901). */
export const G_MPS2 = 9.80665
/** Length of track over which the F-factor is averaged, m (the 1 km average of airborne wind shear alerting). */
export const FFACTOR_AVERAGE_M = 1000
/** Spacing of the stretches' starting points along the track, m. */
export const FFACTOR_STEP_M = 10
/** F of this or more counts as hazardous (the 1 km averaged F-factor of airborne alerting: 0.1, from memory). */
export const FFACTOR_HAZARD = 0.1
const TOP_M = 600
const STEPS_PER_STRETCH = FFACTOR_AVERAGE_M / FFACTOR_STEP_M
const EPS = 1e-9

/**
 * The wind of the grid sampled at the heights of a path flown at `pathAngleDeg` from the threshold, every 10 m of
 * track, up to 600 m: u and v in kt, NaN where the data does not reach (above the highest level, or below the
 * lowest one unless it is the surface level, whose wind is taken down to the ground).
 */
export interface PathSamples {
  heightsM: Float64Array
  uKt: Float64Array
  vKt: Float64Array
}

export function samplePath(grid: GridPoint[], pathAngleDeg: number, surfaceCovered: boolean): PathSamples {
  const slope = Math.tan((pathAngleDeg * Math.PI) / 180)
  const last = Math.floor(TOP_M / slope / FFACTOR_STEP_M + EPS)
  const n = last + 1
  const heightsM = new Float64Array(n)
  const uKt = new Float64Array(n)
  const vKt = new Float64Array(n)
  const g = grid.length
  const lowest = g ? grid[0]!.heightAglM : Number.POSITIVE_INFINITY
  const highest = g ? grid[g - 1]!.heightAglM : Number.NEGATIVE_INFINITY
  let seg = 0
  for (let i = 0; i < n; i++) {
    const h = i * FFACTOR_STEP_M * slope
    heightsM[i] = h
    if (h > highest + EPS || (h < lowest - EPS && !surfaceCovered)) {
      uKt[i] = Number.NaN
      vKt[i] = Number.NaN
      continue
    }
    if (h <= lowest || g === 1) {
      uKt[i] = grid[0]!.uKt
      vKt[i] = grid[0]!.vKt
      continue
    }
    while (seg < g - 2 && grid[seg + 1]!.heightAglM < h) seg++
    const a = grid[seg]!
    const b = grid[seg + 1]!
    const span = b.heightAglM - a.heightAglM
    const t = span > 0 ? Math.min(1, (h - a.heightAglM) / span) : 0
    uKt[i] = a.uKt + t * (b.uKt - a.uKt)
    vKt[i] = a.vKt + t * (b.vKt - a.vKt)
  }
  return { heightsM, uKt, vKt }
}

/**
 * Largest 1 km averaged F-factor, horizontal wind only, along one path of one runway end. With Wx the tailwind
 * along the runway heading (m/s), F = (Wx at the stretch's end - Wx at its start) x GS / (g x 1000 m), GS = true
 * airspeed - headwind at the middle of the stretch. Stretches start every 10 m of track from the threshold while
 * their upper end is at or below 600 m; an arrival flies each stretch from its far (high) end to its near end.
 * Null when the data covers no stretch.
 */
export function fFactorOfPath(samples: PathSamples, headingDeg: number, trueAirspeedKt: number,
  arrival: boolean, wx: Float64Array): FFactorResult | null {
  const n = samples.heightsM.length
  const rad = (headingDeg * Math.PI) / 180
  const sinH = Math.sin(rad)
  const cosH = Math.cos(rad)
  // Tailwind along the heading, m/s: Wx = u·sin(hdg) + v·cos(hdg).
  for (let i = 0; i < n; i++) wx[i] = (samples.uKt[i]! * sinH + samples.vKt[i]! * cosH) * MPS_PER_KT
  const total = Math.max(0, n - STEPS_PER_STRETCH)
  const tasMps = trueAirspeedKt * MPS_PER_KT
  const k = 1 / (G_MPS2 * FFACTOR_AVERAGE_M)
  let best = Number.NEGATIVE_INFINITY
  let bestAt = -1
  let bestGs = 0
  let covered = 0
  for (let s = 0; s < total; s++) {
    const near = wx[s]!
    const far = wx[s + STEPS_PER_STRETCH]!
    const mid = wx[s + STEPS_PER_STRETCH / 2]!
    if (Number.isNaN(near) || Number.isNaN(far) || Number.isNaN(mid)) continue
    covered++
    const gs = tasMps + mid // headwind = -Wx
    const f = (arrival ? near - far : far - near) * gs * k
    if (f > best) {
      best = f
      bestAt = s
      bestGs = gs
    }
  }
  if (bestAt < 0) return null
  const nearTrackM = bestAt * FFACTOR_STEP_M
  const farTrackM = nearTrackM + FFACTOR_AVERAGE_M
  const nearHeightM = samples.heightsM[bestAt]!
  const farHeightM = samples.heightsM[bestAt + STEPS_PER_STRETCH]!
  return {
    basis: 'horizontal-wind-only',
    maxF: best,
    startTrackM: arrival ? farTrackM : nearTrackM,
    endTrackM: arrival ? nearTrackM : farTrackM,
    startHeightM: arrival ? farHeightM : nearHeightM,
    endHeightM: arrival ? nearHeightM : farHeightM,
    groundSpeedKt: bestGs / MPS_PER_KT,
    stretchesCovered: covered,
    stretchesTotal: total,
  }
}

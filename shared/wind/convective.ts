import { WindValidationError } from './errors'
import type { HelicityResult, StormMotionMps, ValidationIssue } from './types'

/** Bunkers et al. (2000): deviation of the supercell motion from the 0-6 km mean wind, m/s. */
export const BUNKERS_DEVIATION_MPS = 7.5

type Series = ArrayLike<number>

/** Value of a series at height h, linear between neighbours; h must lie within the heights. */
export function interpolateAt(heightsM: Series, values: Series, h: number): number {
  const n = heightsM.length
  if (h <= heightsM[0]!) return values[0]!
  if (h >= heightsM[n - 1]!) return values[n - 1]!
  let lo = 0
  let hi = n - 1
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1
    if (heightsM[mid]! <= h) lo = mid
    else hi = mid
  }
  const h0 = heightsM[lo]!
  const h1 = heightsM[hi]!
  const t = (h - h0) / (h1 - h0)
  return values[lo]! + t * (values[hi]! - values[lo]!)
}

/** Height-weighted (not pressure-weighted) mean of a piecewise-linear series over [bottom, top]. */
export function layerMean(heightsM: Series, values: Series, bottomM: number, topM: number): number {
  if (topM <= bottomM) return interpolateAt(heightsM, values, bottomM)
  let sum = 0
  let prevH = bottomM
  let prevV = interpolateAt(heightsM, values, bottomM)
  for (let i = 0; i < heightsM.length; i++) {
    const h = heightsM[i]!
    if (h <= bottomM) continue
    if (h >= topM) break
    const val = values[i]!
    sum += 0.5 * (prevV + val) * (h - prevH)
    prevH = h
    prevV = val
  }
  const topV = interpolateAt(heightsM, values, topM)
  sum += 0.5 * (prevV + topV) * (topM - prevH)
  return sum / (topM - bottomM)
}

function checkSeries(heightsM: Series, uMps: Series, vMps: Series, bottomM: number, topM: number): void {
  const issues: ValidationIssue[] = []
  const n = heightsM?.length
  if (typeof n !== 'number' || n < 2 || uMps?.length !== n || vMps?.length !== n) {
    issues.push({ field: 'heightsM', message: 'heights, u and v must be lists of the same length, at least two' })
  }
  else {
    for (let i = 0; i < n; i++) {
      const h = heightsM[i]
      if (typeof h !== 'number' || !Number.isFinite(h) || (i > 0 && !(h > heightsM[i - 1]!))) {
        issues.push({ index: i, field: 'heightsM', message: 'heights must be finite and strictly increasing' })
        break
      }
      if (typeof uMps[i] !== 'number' || !Number.isFinite(uMps[i]!) || typeof vMps[i] !== 'number' || !Number.isFinite(vMps[i]!)) {
        issues.push({ index: i, field: 'uMps', message: 'u and v must be finite numbers' })
        break
      }
    }
    if (!issues.length && !(Number.isFinite(bottomM) && Number.isFinite(topM) && bottomM < topM
      && bottomM >= heightsM[0]! && topM <= heightsM[n - 1]!)) {
      issues.push({ field: 'layer', message: `the layer must lie within the data (${heightsM[0]} to ${heightsM[n - 1]} m), bottom below top` })
    }
  }
  if (issues.length) throw new WindValidationError(issues)
}

/** Unchecked SRH over [bottom, top]: sum of (u[n+1]-cx)(v[n]-cy) - (u[n]-cx)(v[n+1]-cy). */
export function helicityOf(heightsM: Series, uMps: Series, vMps: Series, bottomM: number, topM: number,
  stormUMps: number, stormVMps: number): HelicityResult {
  let positive = 0
  let negative = 0
  let pu = interpolateAt(heightsM, uMps, bottomM) - stormUMps
  let pv = interpolateAt(heightsM, vMps, bottomM) - stormVMps
  const addTo = (nu: number, nv: number): void => {
    const term = nu * pv - pu * nv
    if (term > 0) positive += term
    else negative += term
    pu = nu
    pv = nv
  }
  for (let i = 0; i < heightsM.length; i++) {
    const h = heightsM[i]!
    if (h <= bottomM) continue
    if (h >= topM) break
    addTo(uMps[i]! - stormUMps, vMps[i]! - stormVMps)
  }
  addTo(interpolateAt(heightsM, uMps, topM) - stormUMps, interpolateAt(heightsM, vMps, topM) - stormVMps)
  return { positiveM2s2: positive, negativeM2s2: negative, totalM2s2: positive + negative }
}

/**
 * Storm-relative helicity (m^2/s^2) of the layer [bottomM, topM] for a storm moving at (stormUMps, stormVMps),
 * Markowski and Richardson (2010) discrete form, linear between levels.
 */
export function stormRelativeHelicity(heightsM: Series, uMps: Series, vMps: Series,
  layer: { bottomM?: number, topM: number, stormUMps: number, stormVMps: number }): HelicityResult {
  const bottomM = layer?.bottomM ?? heightsM?.[0] ?? 0
  const topM = layer?.topM
  checkSeries(heightsM, uMps, vMps, bottomM, topM)
  if (!Number.isFinite(layer.stormUMps) || !Number.isFinite(layer.stormVMps)) {
    throw new WindValidationError([{ field: 'stormUMps', message: 'storm motion must be finite numbers' }])
  }
  return helicityOf(heightsM, uMps, vMps, bottomM, topM, layer.stormUMps, layer.stormVMps)
}

/** Unchecked Bunkers: heights AGL, the lowest level taken as the surface (0 km). */
export function bunkersOf(heightsM: Series, uMps: Series, vMps: Series): StormMotionMps {
  const base = Math.max(0, heightsM[0]!)
  const meanU = layerMean(heightsM, uMps, base, 6000)
  const meanV = layerMean(heightsM, vMps, base, 6000)
  const shearU = layerMean(heightsM, uMps, 5500, 6000) - layerMean(heightsM, uMps, base, 500)
  const shearV = layerMean(heightsM, vMps, 5500, 6000) - layerMean(heightsM, vMps, base, 500)
  const shearMag = Math.hypot(shearU, shearV)
  // No shear, no preferred side: both movers stay on the mean wind.
  const k = shearMag > 0 ? BUNKERS_DEVIATION_MPS / shearMag : 0
  return {
    rightUMps: meanU + k * shearV,
    rightVMps: meanV - k * shearU,
    leftUMps: meanU - k * shearV,
    leftVMps: meanV + k * shearU,
    meanUMps: meanU,
    meanVMps: meanV,
    shearUMps: shearU,
    shearVMps: shearV,
  }
}

/**
 * Bunkers et al. (2000) right- and left-mover storm motion (m/s): 0-6 km mean wind (height-weighted) deviated
 * 7.5 m/s perpendicular to the shear from the 0-0.5 km mean to the 5.5-6 km mean. Heights AGL, reaching 6 km.
 */
export function bunkersStormMotion(heightsM: Series, uMps: Series, vMps: Series): StormMotionMps {
  checkSeries(heightsM, uMps, vMps, heightsM?.[0] ?? 0, 6000)
  if (heightsM[0]! > 500) {
    throw new WindValidationError([{ field: 'heightsM', message: 'the lowest level must be in the lowest 500 m' }])
  }
  return bunkersOf(heightsM, uMps, vMps)
}

/** Unchecked streamwise share of horizontal vorticity over [bottom, top] relative to a storm motion. */
export function streamwiseShareOf(heightsM: Series, uMps: Series, vMps: Series, bottomM: number, topM: number,
  stormUMps: number, stormVMps: number): number {
  let streamwise = 0
  let total = 0
  let ph = bottomM
  let pu = interpolateAt(heightsM, uMps, bottomM)
  let pv = interpolateAt(heightsM, vMps, bottomM)
  const segment = (h: number, u: number, v: number): void => {
    const dz = h - ph
    if (dz > 0) {
      // Horizontal vorticity k x dV/dz, times dz: (-dv, du).
      const wx = -(v - pv)
      const wy = u - pu
      const sru = 0.5 * (u + pu) - stormUMps
      const srv = 0.5 * (v + pv) - stormVMps
      const sr = Math.hypot(sru, srv)
      total += Math.hypot(wx, wy)
      if (sr > 0) streamwise += (wx * sru + wy * srv) / sr
    }
    ph = h
    pu = u
    pv = v
  }
  for (let i = 0; i < heightsM.length; i++) {
    const h = heightsM[i]!
    if (h <= bottomM) continue
    if (h >= topM) break
    segment(h, uMps[i]!, vMps[i]!)
  }
  segment(topM, interpolateAt(heightsM, uMps, topM), interpolateAt(heightsM, vMps, topM))
  return total > 0 ? streamwise / total : 0
}

/**
 * Streamwise share (-1..1) of the horizontal vorticity of [bottomM, topM] relative to the storm-relative inflow
 * (Doswell 1991 streamwise/crosswise split); 1 = all streamwise, 0 = all crosswise or no shear.
 */
export function streamwiseVorticityShare(heightsM: Series, uMps: Series, vMps: Series,
  layer: { bottomM?: number, topM: number, stormUMps: number, stormVMps: number }): number {
  const bottomM = layer?.bottomM ?? heightsM?.[0] ?? 0
  checkSeries(heightsM, uMps, vMps, bottomM, layer?.topM)
  if (!Number.isFinite(layer.stormUMps) || !Number.isFinite(layer.stormVMps)) {
    throw new WindValidationError([{ field: 'stormUMps', message: 'storm motion must be finite numbers' }])
  }
  return streamwiseShareOf(heightsM, uMps, vMps, bottomM, layer.topM, layer.stormUMps, layer.stormVMps)
}

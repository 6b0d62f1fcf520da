import { signedAngleDiffDeg } from './angles'
import { bunkersOf, helicityOf, streamwiseShareOf } from './convective'
import { fFactorOfPath, samplePath } from './ffactor'
import { componentsOf, designatorMismatch } from './runway'
import { MPS_PER_KT } from '../units'
import { SURFACE_LEVEL_MAX_AGL_M, normaliseProfile } from './validate'
import { uvToDirectionDeg } from './vector'
import type {
  ConvectiveContext, Coverage, GridPoint, HeightComponents, NormalisedLevel, PathChange, PathGeometry, ProfileAnalysis,
  ProfileAnalysisInput, RunwayEndAnalysis, ShearAnalysis, ShearClassBoundsKtPer100ft, ShearIntensity, ShearLayer,
  SurfaceComponents, TurnSense, VectorDifference, WindVectorKt, WindWarning,
} from './types'

export const GRID_STEP_M = 30
export const GRID_TOP_M = 600
/** Headwind change of 15 kt or more along the path: airport wind shear alerting practice (national rule after ICAO Annex 3). */
export const ALERTING_PRACTICE_KT = 15
const FT100_M = 30.48
const CONVECTIVE_TOP_M = 6000
// Direction of a near-calm wind is noise; it takes no part in the turn.
const TURN_MIN_SPEED_KT = 0.5
// A net turn below this is no turn (directions are briefed to whole degrees).
const TURN_NONE_DEG = 0.5
// Heights that differ by less than this are one grid point.
const SAME_POINT_M = 1e-6

/** Intensity class of a shear in kt per 100 ft against inclusive upper bounds. */
export function classifyShear(shearKtPer100ft: number, bounds: ShearClassBoundsKtPer100ft): ShearIntensity {
  if (shearKtPer100ft <= bounds.lightMaxKtPer100ft) return 'light'
  if (shearKtPer100ft <= bounds.moderateMaxKtPer100ft) return 'moderate'
  if (shearKtPer100ft <= bounds.strongMaxKtPer100ft) return 'strong'
  return 'severe'
}

/**
 * Largest fall (airspeed loss) and rise (gain) of the headwind between two points met in path order,
 * by a running-extreme scan. `order` is +1 to walk the arrays upwards (departure), -1 downwards (arrival).
 */
export function pathChange(heightsM: ArrayLike<number>, headwindKt: ArrayLike<number>, order: 1 | -1,
  complete: boolean): PathChange {
  const n = heightsM.length
  const start = order === 1 ? 0 : n - 1
  let maxSoFar = headwindKt[start]!
  let maxAt = start
  let minSoFar = maxSoFar
  let minAt = start
  let loss = 0
  let gain = 0
  let lossFrom = -1
  let lossTo = -1
  let gainFrom = -1
  let gainTo = -1
  for (let k = 1; k < n; k++) {
    const i = order === 1 ? k : n - 1 - k
    const h = headwindKt[i]!
    if (maxSoFar - h > loss) {
      loss = maxSoFar - h
      lossFrom = maxAt
      lossTo = i
    }
    if (h - minSoFar > gain) {
      gain = h - minSoFar
      gainFrom = minAt
      gainTo = i
    }
    if (h > maxSoFar) {
      maxSoFar = h
      maxAt = i
    }
    if (h < minSoFar) {
      minSoFar = h
      minAt = i
    }
  }
  return {
    maxAirspeedLossKt: loss,
    maxAirspeedGainKt: gain,
    lossFromHeightM: lossFrom < 0 ? null : heightsM[lossFrom]!,
    lossToHeightM: lossTo < 0 ? null : heightsM[lossTo]!,
    gainFromHeightM: gainFrom < 0 ? null : heightsM[gainFrom]!,
    gainToHeightM: gainTo < 0 ? null : heightsM[gainTo]!,
    exceedsAlertingPractice15Kt: loss >= ALERTING_PRACTICE_KT || gain >= ALERTING_PRACTICE_KT,
    startHeightM: heightsM[start]!,
    endHeightM: heightsM[order === 1 ? n - 1 : 0]!,
    complete,
  }
}

function vectorKt(uKt: number, vKt: number): WindVectorKt {
  return { uKt, vKt, speedKt: Math.hypot(uKt, vKt), directionDeg: uvToDirectionDeg(uKt, vKt) }
}

/** Grid of every 30 m in 0-600 m within the data, plus the original levels there; linear in u and v. */
function buildGrid(levels: NormalisedLevel[]): GridPoint[] {
  const grid: GridPoint[] = []
  const n = levels.length
  const lowest = levels[0]!.heightAglM
  const highest = levels[n - 1]!.heightAglM
  let li = 0 // index of the next original level to place
  let seg = 0 // levels[seg] <= h <= levels[seg + 1]
  const push = (h: number, u: number, v: number, sourceIndex: number | null): void => {
    grid.push({ heightAglM: h, uKt: u, vKt: v, speedKt: Math.hypot(u, v), directionDeg: uvToDirectionDeg(u, v), sourceIndex })
  }
  // Original levels keep their own direction and speed (no round trip through u and v).
  const pushLevel = (lv: NormalisedLevel): void => {
    grid.push({ heightAglM: lv.heightAglM, uKt: lv.uKt, vKt: lv.vKt, speedKt: lv.speedKt, directionDeg: lv.directionDeg, sourceIndex: lv.sourceIndex })
  }
  for (let step = 0; step * GRID_STEP_M <= GRID_TOP_M; step++) {
    const h = step * GRID_STEP_M
    // Original levels below this ladder point come first.
    while (li < n && levels[li]!.heightAglM < h - SAME_POINT_M) {
      pushLevel(levels[li]!)
      li++
    }
    if (h < lowest - SAME_POINT_M || h > highest + SAME_POINT_M) continue
    if (li < n && Math.abs(levels[li]!.heightAglM - h) <= SAME_POINT_M) {
      pushLevel(levels[li]!)
      li++
      continue
    }
    while (seg < n - 2 && levels[seg + 1]!.heightAglM < h) seg++
    const a = levels[seg]!
    const b = levels[seg + 1]!
    const t = (h - a.heightAglM) / (b.heightAglM - a.heightAglM)
    push(h, a.uKt + t * (b.uKt - a.uKt), a.vKt + t * (b.vKt - a.vKt), null)
  }
  return grid
}

function analyseShear(grid: GridPoint[], surface: NormalisedLevel | null, coverage: Coverage,
  bounds: ShearClassBoundsKtPer100ft): ShearAnalysis {
  const layers: ShearLayer[] = []
  let strongest: ShearLayer | null = null
  // Walk the grid: each ladder layer spans the grid points between two ladder heights (clamped to the data).
  let baseIdx = 0
  for (let k = 1; k < grid.length; k++) {
    const h = grid[k]!.heightAglM
    const onLadder = Math.abs(h / GRID_STEP_M - Math.round(h / GRID_STEP_M)) * GRID_STEP_M <= SAME_POINT_M
    if (!onLadder && k < grid.length - 1) continue
    const base = grid[baseIdx]!
    const top = grid[k]!
    const thicknessM = top.heightAglM - base.heightAglM
    if (thicknessM > SAME_POINT_M) {
      const diffKt = Math.hypot(top.uKt - base.uKt, top.vKt - base.vKt)
      const shearKtPer100ft = (diffKt / thicknessM) * FT100_M
      const layer: ShearLayer = {
        baseM: base.heightAglM,
        topM: top.heightAglM,
        shearKtPer100ft,
        shearMpsPer30m: (diffKt * MPS_PER_KT / thicknessM) * GRID_STEP_M,
        intensity: classifyShear(shearKtPer100ft, bounds),
      }
      layers.push(layer)
      if (!strongest || shearKtPer100ft > strongest.shearKtPer100ft) strongest = layer
    }
    baseIdx = k
  }

  let surfaceTo600m: VectorDifference | null = null
  let surfaceTo600mReason: string | null = null
  const top600 = grid.length ? grid[grid.length - 1]! : null
  if (!surface) surfaceTo600mReason = 'no surface level (within 30 m of the ground)'
  else if (!coverage.reaches600m || !top600) surfaceTo600mReason = `the profile stops at ${coverage.highestAglM.toFixed(0)} m above ground, short of 600 m`
  else {
    const duKt = top600.uKt - surface.uKt
    const dvKt = top600.vKt - surface.vKt
    const vectorDiffKt = Math.hypot(duKt, dvKt)
    surfaceTo600m = {
      baseM: surface.heightAglM,
      topM: top600.heightAglM,
      vectorDiffKt,
      vectorDiffMps: vectorDiffKt * MPS_PER_KT,
      duKt,
      dvKt,
      meanShearKtPer100ft: (vectorDiffKt / (top600.heightAglM - surface.heightAglM)) * FT100_M,
    }
  }

  // Accumulated turn with height, skipping near-calm points whose direction means nothing.
  let turn = 0
  let prevDir = -1
  let turnBaseM: number | null = null
  let turnTopM: number | null = null
  for (const p of grid) {
    if (p.speedKt < TURN_MIN_SPEED_KT) continue
    if (prevDir >= 0) {
      turn += signedAngleDiffDeg(prevDir, p.directionDeg)
      turnTopM = p.heightAglM
    }
    else {
      turnBaseM = p.heightAglM
    }
    prevDir = p.directionDeg
  }
  if (turnTopM === null) turnBaseM = null
  const turnSense: TurnSense = turn >= TURN_NONE_DEG ? 'veering' : turn <= -TURN_NONE_DEG ? 'backing' : 'none'
  return {
    layers,
    strongestLayer: strongest,
    surfaceTo600m,
    surfaceTo600mReason,
    directionTurnDeg: Math.abs(turn),
    directionTurnSignedDeg: turn,
    turnSense,
    turnBaseM,
    turnTopM,
    classBounds: bounds,
  }
}

/** The grid cut at a corridor's top height (interpolated there when the data reaches it). */
interface CorridorGrid {
  heights: Float64Array
  u: Float64Array
  v: Float64Array
  complete: boolean
}

function corridorGrid(grid: GridPoint[], topM: number, surfaceCovered: boolean): CorridorGrid {
  const n = grid.length
  let count = 0
  while (count < n && grid[count]!.heightAglM <= topM + SAME_POINT_M) count++
  const reaches = n > 0 && grid[n - 1]!.heightAglM >= topM - SAME_POINT_M
  const addTop = reaches && count < n && count > 0 && Math.abs(grid[count - 1]!.heightAglM - topM) > SAME_POINT_M
  const m = count + (addTop ? 1 : 0)
  const heights = new Float64Array(m)
  const u = new Float64Array(m)
  const v = new Float64Array(m)
  for (let k = 0; k < count; k++) {
    heights[k] = grid[k]!.heightAglM
    u[k] = grid[k]!.uKt
    v[k] = grid[k]!.vKt
  }
  if (addTop) {
    const a = grid[count - 1]!
    const b = grid[count]!
    const t = (topM - a.heightAglM) / (b.heightAglM - a.heightAglM)
    heights[count] = topM
    u[count] = a.uKt + t * (b.uKt - a.uKt)
    v[count] = a.vKt + t * (b.vKt - a.vKt)
  }
  return { heights, u, v, complete: surfaceCovered && reaches }
}

function corridorChange(c: CorridorGrid, headingDeg: number, order: 1 | -1, scratch: Float64Array): PathChange | null {
  const m = c.heights.length
  if (m < 2) return null
  const rad = (headingDeg * Math.PI) / 180
  const sinH = Math.sin(rad)
  const cosH = Math.cos(rad)
  const headwinds = scratch.subarray(0, m)
  for (let k = 0; k < m; k++) headwinds[k] = -(c.u[k]! * sinH + c.v[k]! * cosH)
  return pathChange(c.heights, headwinds, order, c.complete)
}

function analyseRunwayEnds(input: { designator: string, trueHeadingDeg: number, magneticHeadingDeg?: number }[],
  grid: GridPoint[], surface: NormalisedLevel | null, complete: boolean, paths: PathGeometry,
  warnings: WindWarning[]): RunwayEndAnalysis[] {
  const out: RunwayEndAnalysis[] = []
  const n = grid.length
  const heights = new Float64Array(n)
  for (let k = 0; k < n; k++) heights[k] = grid[k]!.heightAglM
  const headwinds = new Float64Array(n)
  const surfaceCovered = surface !== null
  const arrivalCorridor = corridorGrid(grid, paths.arrivalCorridorTopM, surfaceCovered)
  const departureCorridor = corridorGrid(grid, paths.departureCorridorTopM, surfaceCovered)
  const arrivalSamples = input.length ? samplePath(grid, paths.arrivalGlidePathDeg, surfaceCovered) : null
  const departureSamples = input.length ? samplePath(grid, paths.departureClimbDeg, surfaceCovered) : null
  const scratch = new Float64Array(Math.max(n + 1, arrivalSamples?.heightsM.length ?? 0, departureSamples?.heightsM.length ?? 0))
  for (const end of input) {
    const byHeight: HeightComponents[] = new Array(n)
    for (let k = 0; k < n; k++) {
      const p = grid[k]!
      const c = componentsOf(p.directionDeg, p.speedKt, end.trueHeadingDeg)
      headwinds[k] = c.headwindKt
      byHeight[k] = { heightAglM: p.heightAglM, headwindKt: c.headwindKt, crosswindKt: c.crosswindKt, crosswindSide: c.crosswindSide }
    }
    let surfaceComponents: SurfaceComponents | null = null
    if (surface) {
      const c = componentsOf(surface.directionDeg, surface.speedKt, end.trueHeadingDeg)
      surfaceComponents = { heightAglM: surface.heightAglM, ...c }
      if (surface.gustKt !== undefined) {
        const g = componentsOf(surface.directionDeg, surface.gustKt, end.trueHeadingDeg)
        surfaceComponents.gustHeadwindKt = g.headwindKt
        surfaceComponents.gustCrosswindKt = g.crosswindKt
      }
    }
    const designatorCheck = end.magneticHeadingDeg === undefined ? null : designatorMismatch(end.designator, end.magneticHeadingDeg)
    if (designatorCheck?.mismatch) {
      warnings.push({
        code: 'designator-mismatch',
        designator: end.designator,
        message: `Runway ${end.designator}: magnetic heading ${end.magneticHeadingDeg!.toFixed(0)}° is ${designatorCheck.differenceDeg.toFixed(0)}° away from the designator; check the heading.`,
      })
    }
    const result: RunwayEndAnalysis = {
      designator: end.designator,
      trueHeadingDeg: end.trueHeadingDeg,
      designatorCheck,
      surface: surfaceComponents,
      surfaceReason: surface ? null : 'no surface level (within 30 m of the ground): surface components left out',
      byHeight,
      arrival: n >= 2 ? pathChange(heights, headwinds, -1, complete) : null,
      departure: n >= 2 ? pathChange(heights, headwinds, 1, complete) : null,
      arrivalCorridor: corridorChange(arrivalCorridor, end.trueHeadingDeg, -1, scratch),
      departureCorridor: corridorChange(departureCorridor, end.trueHeadingDeg, 1, scratch),
      fFactor: {
        arrival: fFactorOfPath(arrivalSamples!, end.trueHeadingDeg, paths.arrivalTrueAirspeedKt, true, scratch),
        departure: fFactorOfPath(departureSamples!, end.trueHeadingDeg, paths.departureTrueAirspeedKt, false, scratch),
      },
    }
    if (end.magneticHeadingDeg !== undefined) result.magneticHeadingDeg = end.magneticHeadingDeg
    out.push(result)
  }
  return out
}

function analyseConvective(levels: NormalisedLevel[], surface: NormalisedLevel | null, coverage: Coverage): ConvectiveContext {
  if (!surface) return { available: false, reason: 'needs a surface level (within 30 m of the ground)' }
  if (!coverage.reaches6km) {
    return { available: false, reason: `needs a profile to 6 km above ground; this one stops at ${coverage.highestAglM.toFixed(0)} m` }
  }
  const n = levels.length
  const h = new Float64Array(n)
  const u = new Float64Array(n)
  const v = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    const lv = levels[i]!
    h[i] = lv.heightAglM
    u[i] = lv.uKt * MPS_PER_KT
    v[i] = lv.vKt * MPS_PER_KT
  }
  const base = surface.heightAglM
  const storm = bunkersOf(h, u, v)
  let u6 = 0
  let v6 = 0
  // Wind at exactly 6 km, linear between the levels around it.
  for (let i = 1; i < n; i++) {
    if (h[i]! >= CONVECTIVE_TOP_M) {
      const t = (CONVECTIVE_TOP_M - h[i - 1]!) / (h[i]! - h[i - 1]!)
      u6 = u[i - 1]! + t * (u[i]! - u[i - 1]!)
      v6 = v[i - 1]! + t * (v[i]! - v[i - 1]!)
      break
    }
  }
  const bulkU = (u6 - u[0]!) / MPS_PER_KT
  const bulkV = (v6 - v[0]!) / MPS_PER_KT
  return {
    available: true,
    meanWind0to6kmKt: vectorKt(storm.meanUMps / MPS_PER_KT, storm.meanVMps / MPS_PER_KT),
    bulkShear0to6kmKt: Math.hypot(bulkU, bulkV),
    bulkShear0to6kmVectorKt: vectorKt(bulkU, bulkV),
    bunkersRight: vectorKt(storm.rightUMps / MPS_PER_KT, storm.rightVMps / MPS_PER_KT),
    bunkersLeft: vectorKt(storm.leftUMps / MPS_PER_KT, storm.leftVMps / MPS_PER_KT),
    srh0to1kmM2s2: helicityOf(h, u, v, base, 1000, storm.rightUMps, storm.rightVMps).totalM2s2,
    srh0to3kmM2s2: helicityOf(h, u, v, base, 3000, storm.rightUMps, storm.rightVMps).totalM2s2,
    streamwiseShare0to500m: streamwiseShareOf(h, u, v, base, 500, storm.rightUMps, storm.rightVMps),
  }
}

/**
 * The one complete computation: validates and normalises the profile, builds the 0-600 m grid, shear layers,
 * turn, per-runway-end components and arrival/departure headwind changes, and the convective context.
 * Throws only WindValidationError.
 */
export function analyseProfile(input: ProfileAnalysisInput): ProfileAnalysis {
  const { levels, runwayEnds, bounds, paths, warnings } = normaliseProfile(input)
  const lowest = levels[0]!
  const highest = levels[levels.length - 1]!
  const coverage: Coverage = {
    lowestAglM: lowest.heightAglM,
    highestAglM: highest.heightAglM,
    startsAtSurface: lowest.heightAglM <= SURFACE_LEVEL_MAX_AGL_M,
    reaches600m: highest.heightAglM >= GRID_TOP_M - SAME_POINT_M,
    reaches6km: highest.heightAglM >= CONVECTIVE_TOP_M - SAME_POINT_M,
  }
  const surface = coverage.startsAtSurface ? lowest : null
  const surfaceReason = surface
    ? null
    : `the lowest level is ${lowest.heightAglM.toFixed(0)} m above ground; a surface level within ${SURFACE_LEVEL_MAX_AGL_M} m is needed`
  if (!surface) {
    warnings.push({ code: 'no-surface-level', message: `No surface level: ${surfaceReason}. Surface runway components are left out.` })
  }
  if (!coverage.reaches600m) {
    warnings.push({ code: 'short-of-600m', message: `The profile stops at ${highest.heightAglM.toFixed(0)} m above ground, short of 600 m: nothing above is extrapolated.` })
  }
  const grid = buildGrid(levels)
  const shear = analyseShear(grid, surface, coverage, bounds)
  const pathComplete = surface !== null && coverage.reaches600m
  const runwayResults = analyseRunwayEnds(runwayEnds, grid, surface, pathComplete, paths, warnings)
  const convective = analyseConvective(levels, surface, coverage)
  if (!convective.available) {
    warnings.push({ code: 'convective-unavailable', message: `Convective context not available: ${convective.reason}.` })
  }
  return { levels, grid, coverage, surface, surfaceReason, shear, runwayEnds: runwayResults, convective, paths, warnings }
}

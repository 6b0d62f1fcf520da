/**
 * The runway briefing of one airfield: which profile, what the wind engine makes of it per runway end,
 * how it stands against the limits, and the runway ends ranked by suitability.
 * `assembleBriefing` and `rankRunwayEnds` are pure (tests call them directly); `loadBriefing` reads the database.
 */
import type { Airfield, Profile, RunwayEnd } from '../../db/schema'
import { runwayComponents, uvToWind, GRID_TOP_M, type GridPoint, type ProfileAnalysis, type RunwayEndAnalysis } from '../../../shared/wind'
import { evaluateLimits, type LimitCheck, type Limits } from '../../../shared/limits'
import { levelInputsOf, pressureInputsOf, runwayEndInputsOf, type StoredProfileAnalysis } from '../profiles/analysis'
import { eq, schema, useDB } from '../../utils/db'
import { M_PER_FT } from '../../../shared/units'
import { loadAirfield } from '../airfields/lookup'
import type { effectiveLimits } from '../alerts/limits'
import { VEERLINE_CAUTION } from '../../../shared/utils/caution'
import { profileStatusAt, type ProfileStatus } from '../../../shared/briefing/status'
import { keyHeights } from '../../../shared/briefing/key-heights'
import { airfieldVerdict } from '../../../shared/briefing/verdict'
import type { BriefingChange } from '../../../shared/briefing/change'

/** The limits a briefing is held against: the safety office's sets layered over the defaults. */
export type BriefingLimits = Pick<Awaited<ReturnType<typeof effectiveLimits>>, 'limits' | 'limitsFor' | 'source'>

export type { ProfileStatus }

/** The status words when no time was chosen (now); see statusWordsAt for a chosen time. */
export const STATUS_WORDS: Record<ProfileStatus, string> = {
  current: 'Current: valid now',
  expired: 'Expired: its validity has ended',
  upcoming: 'Not yet valid',
  superseded: 'Superseded by a newer profile',
  withdrawn: 'Withdrawn: do not use',
}

/**
 * Where a profile stands at `at` (now unless a time was chosen). Withdrawn and superseded override validity.
 * `supersededThen`: a supersession record covers `at` (supersession by time: it may be in force at other times).
 */
export function profileStatus(p: Pick<Profile, 'status' | 'validFrom' | 'validTo'>, at: Date, supersededThen = false): ProfileStatus {
  return profileStatusAt(p, at, supersededThen)
}

export type RankedEnd = {
  rank: number
  designator: string
  /** Surface headwind (negative = tailwind), or null without a surface level. */
  headwindKt: number | null
  crosswindKt: number | null
  withinLimits: boolean
  exceeded: LimitCheck['kind'][]
  near: LimitCheck['kind'][]
  reasons: string[]
}

/**
 * Suitability order: ends with none of their own limits exceeded first, then ends with exceedances;
 * within each group the most surface headwind first, then the least crosswind, then the designator.
 * Airfield-wide checks (layer shear, vector difference) touch every end alike, so they do not reorder.
 */
export function rankRunwayEnds(ends: Pick<RunwayEndAnalysis, 'designator' | 'surface'>[], checks: LimitCheck[]): RankedEnd[] {
  const rows = ends.map((end) => {
    const own = checks.filter(c => c.designator === end.designator)
    const exceeded = own.filter(c => c.state === 'exceeded')
    return {
      designator: end.designator,
      headwindKt: end.surface?.headwindKt ?? null,
      crosswindKt: end.surface?.crosswindKt ?? null,
      withinLimits: exceeded.length === 0,
      exceeded: exceeded.map(c => c.kind),
      near: own.filter(c => c.state === 'near').map(c => c.kind),
      reasons: [...exceeded, ...own.filter(c => c.state === 'near')].map(c => c.message),
    }
  })
  rows.sort((a, b) => {
    if (a.withinLimits !== b.withinLimits) return a.withinLimits ? -1 : 1
    const ha = a.headwindKt ?? Number.NEGATIVE_INFINITY
    const hb = b.headwindKt ?? Number.NEGATIVE_INFINITY
    if (ha !== hb) return hb - ha
    const ca = Math.abs(a.crosswindKt ?? Number.POSITIVE_INFINITY)
    const cb = Math.abs(b.crosswindKt ?? Number.POSITIVE_INFINITY)
    if (ca !== cb) return ca - cb
    return a.designator.localeCompare(b.designator)
  })
  return rows.map((r, i) => ({ rank: i + 1, ...r }))
}

/**
 * Wind and components every 100 ft from the ground to 600 m, interpolated linearly in u and v between
 * the engine's grid points (the grid is itself linear in u and v between the filed levels).
 */
export function feetSteps(grid: GridPoint[], ends: Pick<RunwayEndAnalysis, 'designator' | 'trueHeadingDeg'>[]) {
  if (grid.length < 2) return []
  const rows = []
  const low = grid[0]!.heightAglM
  const high = Math.min(grid[grid.length - 1]!.heightAglM, GRID_TOP_M)
  for (let ft = 0; ft * M_PER_FT <= high + 1e-9; ft += 100) {
    const h = ft * M_PER_FT
    if (h < low - 1e-9) continue
    const j = Math.max(1, grid.findIndex(g => g.heightAglM >= h - 1e-9))
    const a = grid[j - 1]!
    const b = grid[j]!
    const t = b.heightAglM === a.heightAglM ? 0 : (h - a.heightAglM) / (b.heightAglM - a.heightAglM)
    const uKt = a.uKt + t * (b.uKt - a.uKt)
    const vKt = a.vKt + t * (b.vKt - a.vKt)
    const wind = uvToWind(uKt, vKt)
    rows.push({
      heightAglFt: ft,
      heightAglM: h,
      directionDeg: wind.directionDeg,
      speedKt: wind.speed,
      components: ends.map(e => ({ designator: e.designator, ...runwayComponents(wind.directionDeg, wind.speed, e.trueHeadingDeg) })),
    })
  }
  return rows
}

export function publicAirfield(a: Airfield, ends: RunwayEnd[]) {
  return {
    code: a.code, name: a.name, latitudeDeg: a.latitudeDeg, longitudeDeg: a.longitudeDeg, elevationM: a.elevationM,
    runwayEnds: [...ends].sort((x, y) => x.designator.localeCompare(y.designator))
      .map(e => ({ designator: e.designator, runwayId: e.runwayId, trueHeadingDeg: e.trueHeadingDeg })),
  }
}

/**
 * Everything a briefing shows that does not depend on the time it is read, from an analysed stored profile and the
 * limits, and the change against the profile it superseded (when there is one). Pure.
 */
export function assembleBriefing(stored: StoredProfileAnalysis, limitSet: BriefingLimits, change: BriefingChange | null = null) {
  const { analysis, profile, airfield, runwayEnds, declination } = stored
  const checks = evaluateLimits(analysis, limitSet.limits, limitSet.limitsFor, profile.reportedWindShear ?? null)
  const ranking = rankRunwayEnds(analysis.runwayEnds, checks)
  const ends = analysis.runwayEnds.map((end) => {
    const own = checks.filter(c => c.designator === end.designator)
    const reciprocal = runwayEnds.find(r => r.designator === end.designator)
    const other = reciprocal ? runwayEnds.find(r => r.runwayId === reciprocal.runwayId && r.id !== reciprocal.id) : undefined
    return {
      ...end,
      reciprocalDesignator: other?.designator ?? null,
      limits: limitSet.limitsFor(end.designator),
      checks: own,
      exceeded: own.filter(c => c.state === 'exceeded'),
      near: own.filter(c => c.state === 'near'),
      rank: ranking.find(r => r.designator === end.designator)!.rank,
      // Every filed level's components (above 600 m too), for the polar display and its table.
      levels: analysis.levels.map(l => ({ sourceIndex: l.sourceIndex, heightAglM: l.heightAglM,
        ...runwayComponents(l.directionDeg, l.speedKt, end.trueHeadingDeg) })),
    }
  })
  const endInputs = analysis.runwayEnds.map(e => ({ designator: e.designator, trueHeadingDeg: e.trueHeadingDeg }))
  return {
    airfield: publicAirfield(airfield, runwayEnds),
    declination: { declinationDeg: declination.declinationDeg, source: declination.source, reason: declination.reason,
      date: declination.date.toISOString() },
    limits: { values: limitSet.limits, source: limitSet.source },
    // The engine's own input, echoed so anyone can re-run it and compare.
    input: {
      levels: levelInputsOf(stored.levels),
      heightReference: profile.heightReference,
      elevationM: airfield.elevationM,
      runwayEnds: runwayEndInputsOf(runwayEnds, declination.declinationDeg),
      // QNH, station pressure and the airfield's path settings: without them a re-run would place levels otherwise.
      ...pressureInputsOf(profile, airfield),
    },
    levels: analysis.levels,
    grid: analysis.grid,
    feetSteps: feetSteps(analysis.grid, analysis.runwayEnds),
    coverage: analysis.coverage,
    surface: analysis.surface,
    surfaceReason: analysis.surfaceReason,
    shear: analysis.shear,
    runwayEnds: ends,
    airfieldChecks: checks.filter(c => c.designator === null),
    checks,
    ranking,
    verdict: airfieldVerdict(analysis.runwayEnds.map(e => e.designator), checks),
    // SFC and round heights in each unit, interpolated at exactly those heights (not converted).
    keyHeights: {
      ft: keyHeights(analysis.levels, analysis.surface, endInputs, 'ft'),
      m: keyHeights(analysis.levels, analysis.surface, endInputs, 'm'),
    },
    change,
    convective: analysis.convective,
    warnings: analysis.warnings,
    caution: VEERLINE_CAUTION,
  }
}

export type Briefing = ReturnType<typeof assembleBriefing>

export async function loadAirfieldWithEnds(code: string) {
  const db = useDB()
  const airfield = await loadAirfield(code, db)
  const ends = await db.select().from(schema.runwayEnds).where(eq(schema.runwayEnds.airfieldId, airfield.id))
  return { airfield, ends }
}

export type { ProfileAnalysis, Limits }

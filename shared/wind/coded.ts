import { WindValidationError } from './errors'
import { M_PER_FT, MPS_PER_KT } from '../units'
import type {
  CodedReport, CodedReportKind, CodedRunwayShear, CodedShearLevel, CodedSurfaceWind, LevelInput, ValidationIssue,
} from './types'

/** Height given to a coded surface wind: the WMO standard anemometer height of 10 m (common practice). */
export const CODED_SURFACE_HEIGHT_M = 10
const MAX_LINE_CHARS = 4000

// WMO-No. 306 FM 15 / FM 51: dddff[f][Gfmfm[fm]]KT|MPS with VRB and P for "more than".
const WIND_RE = /^(\d{3}|VRB)(P?)(\d{2,3})(?:G(P?)(\d{2,3}))?(KT|MPS)$/
const VARIABLE_RE = /^(\d{3})V(\d{3})$/
const SHEAR_RE = /^WS(\d{3})\/(\d{3})(\d{2,3})(KT|MPS)$/
const RUNWAY_RE = /^R(?:WY)?(\d{2}[LCR]?)$/

const toKt = (value: number, unit: 'KT' | 'MPS'): number => (unit === 'KT' ? value : value / MPS_PER_KT)

function parseWind(group: string, issues: ValidationIssue[], line: number | undefined): CodedSurfaceWind | null {
  const bad = (why: string): null => {
    issues.push({ line, field: 'windGroup', message: `wind group "${group}" ${why}` })
    return null
  }
  const m = WIND_RE.exec(group)
  if (!m) return bad('is malformed (expected dddff[Gff]KT or MPS, e.g. 27015G25KT)')
  const [, dir, plus, ff, gustPlus, gg, unitRaw] = m
  const unit = unitRaw as 'KT' | 'MPS'
  const variable = dir === 'VRB'
  const directionDeg = variable ? null : Number(dir)
  const rawSpeed = Number(ff)
  const rawGust = gg === undefined ? undefined : Number(gg)
  if (directionDeg !== null && directionDeg > 360) return bad(`has a direction above 360°`)
  if (ff!.length === 3 && rawSpeed < 100) return bad('has a three-figure speed below 100')
  if (directionDeg === 0 && rawSpeed > 0) return bad('has direction 000 with a speed (000 is for calm only)')
  // P99KT / P49MPS: the speed is more than the figure given.
  const speedAtLeast = plus === 'P'
  const speedKt = toKt(speedAtLeast ? rawSpeed + 1 : rawSpeed, unit)
  const wind: CodedSurfaceWind = {
    group,
    directionDeg,
    variable,
    calm: rawSpeed === 0 && !speedAtLeast,
    speedKt,
    speedAtLeast,
    unit,
  }
  if (rawGust !== undefined) {
    const gustAtLeast = gustPlus === 'P'
    if (!gustAtLeast && rawGust <= rawSpeed) return bad('has a gust not above the mean speed')
    wind.gustKt = toKt(gustAtLeast ? rawGust + 1 : rawGust, unit)
    wind.gustAtLeast = gustAtLeast
  }
  return wind
}

/**
 * Reads the wind content of one METAR, SPECI or TAF line: the surface wind groups (with VRB, calm, P99/P49,
 * gusts and dddVddd), TAF WShhh/dddffKT low-level shear groups and METAR WS Rnn / WS ALL RWY groups.
 * Other groups are passed over; remarks (after RMK) are not read. A malformed wind group is a WindValidationError
 * that names it. `lineNumber` (1-based) is put on every issue.
 */
export function parseCodedReport(line: string, lineNumber?: number): CodedReport {
  if (typeof line !== 'string' || line.trim() === '' || line.length > MAX_LINE_CHARS) {
    throw new WindValidationError([{ line: lineNumber, field: 'line', message: `a report line of 1 to ${MAX_LINE_CHARS} characters is needed` }])
  }
  const tokens = line.trim().toUpperCase().split(/\s+/).map(t => t.replace(/=+$/, '')).filter(t => t !== '')
  const issues: ValidationIssue[] = []
  const first = tokens[0]
  const kind: CodedReportKind = first === 'METAR' || first === 'SPECI' || first === 'TAF' ? first : 'unknown'
  const winds: CodedSurfaceWind[] = []
  const shearLevels: CodedShearLevel[] = []
  let runwayShear: CodedRunwayShear | null = null
  let lastWasWind = false

  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i]!
    if (t === 'RMK') break
    const wasWind = lastWasWind
    lastWasWind = false
    if (t === 'WS') {
      const next = tokens[i + 1]
      const rw = next === undefined ? null : RUNWAY_RE.exec(next)
      runwayShear ??= { allRunways: false, runways: [] }
      if (next === 'ALL' && tokens[i + 2] === 'RWY') {
        runwayShear.allRunways = true
        i += 2
      }
      else if (rw) {
        if (!runwayShear.runways.includes(rw[1]!)) runwayShear.runways.push(rw[1]!)
        i += 1
      }
      else {
        issues.push({ line: lineNumber, field: 'runwayShearGroup', message: `wind shear group "${next === undefined ? 'WS' : `WS ${next}`}" is malformed (expected WS Rnn or WS ALL RWY)` })
        i += next === undefined ? 0 : 1
      }
      continue
    }
    if (t.startsWith('WS') && /\d/.test(t.charAt(2))) {
      const m = SHEAR_RE.exec(t)
      if (!m) {
        issues.push({ line: lineNumber, field: 'shearGroup', message: `low-level wind shear group "${t}" is malformed (expected WShhh/dddffKT, e.g. WS020/27035KT)` })
        continue
      }
      const heightAglFt = Number(m[1]) * 100
      const directionDeg = Number(m[2])
      const unit = m[4] as 'KT' | 'MPS'
      if (directionDeg > 360) {
        issues.push({ line: lineNumber, field: 'shearGroup', message: `low-level wind shear group "${t}" has a direction above 360°` })
        continue
      }
      shearLevels.push({ group: t, heightAglFt, heightAglM: heightAglFt * M_PER_FT, directionDeg, speedKt: toKt(Number(m[3]), unit), unit })
      continue
    }
    const v = VARIABLE_RE.exec(t)
    if (v) {
      const fromDeg = Number(v[1])
      const toDeg = Number(v[2])
      const prev = winds[winds.length - 1]
      if (!wasWind || !prev) {
        issues.push({ line: lineNumber, field: 'variableGroup', message: `variable-direction group "${t}" does not follow a wind group` })
      }
      else if (fromDeg > 360 || toDeg > 360) {
        issues.push({ line: lineNumber, field: 'variableGroup', message: `variable-direction group "${t}" has a direction above 360°` })
      }
      else {
        prev.variableFromDeg = fromDeg
        prev.variableToDeg = toDeg
      }
      continue
    }
    // Station identifiers are letters only: a group that starts like a wind group is read as one.
    if ((t.endsWith('KT') || t.endsWith('MPS')) && /^(\d|VRB)/.test(t)) {
      const wind = parseWind(t, issues, lineNumber)
      if (wind) {
        winds.push(wind)
        lastWasWind = true
      }
    }
  }
  if (issues.length) throw new WindValidationError(issues)

  const surfaceWind = winds[0] ?? null
  const levels: LevelInput[] = []
  const notes: string[] = []
  if (surfaceWind) {
    if (surfaceWind.directionDeg === null && !surfaceWind.calm) {
      notes.push(`Surface wind ${surfaceWind.group} has a variable direction: it gives no profile level.`)
    }
    else {
      const level: LevelInput = { heightM: CODED_SURFACE_HEIGHT_M, directionDeg: surfaceWind.directionDeg ?? 0, speedKt: surfaceWind.speedKt }
      if (surfaceWind.gustKt !== undefined) level.gustKt = surfaceWind.gustKt
      levels.push(level)
    }
    if (surfaceWind.speedAtLeast || surfaceWind.gustAtLeast) {
      notes.push(`Surface wind ${surfaceWind.group} is coded as "more than": the figures are lower bounds.`)
    }
  }
  for (const s of shearLevels) levels.push({ heightFt: s.heightAglFt, directionDeg: s.directionDeg, speedKt: s.speedKt })
  return { kind, surfaceWind, laterWinds: winds.slice(1), shearLevels, runwayShear, levels, notes }
}

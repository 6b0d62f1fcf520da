import { WindValidationError } from './errors'
import { KMH_PER_KT, M_PER_FT, MPS_PER_KT } from '../units'
import { MAX_SPEED_KT } from './validate'
import type {
  CodedPeriod, CodedReport, CodedReportKind, CodedRunwayShear, CodedShearLevel, CodedSpeedUnit, CodedSurfaceWind,
  LevelInput, ValidationIssue,
} from './types'

/** Height given to a coded surface wind: the WMO standard anemometer height of 10 m (common practice). */
export const CODED_SURFACE_HEIGHT_M = 10
/** A METAR's profile is valid from its observation time through the next hour (Veerline default, editable). */
export const METAR_VALIDITY_MINUTES = 60
const MAX_LINE_CHARS = 4000

// WMO-No. 306 FM 15 / FM 51: dddff[f][Gfmfm[fm]]KT|MPS with VRB and P for "more than"; KMH as some states used
// to report (from memory).
const WIND_RE = /^(\d{3}|VRB)(P?)(\d{2,3})(?:G(P?)(\d{2,3}))?(KT|MPS|KMH)$/
const WIND_LIKE_RE = /^(\d|VRB).*(KT|MPS|KMH)$/
const VARIABLE_RE = /^(\d{3})V(\d{3})$/
const SHEAR_RE = /^WS(\d{3})\/(\d{3})(\d{2,3})(KT|MPS|KMH)$/
const RUNWAY_RE = /^R(?:WY)?(\d{2}[LCR]?)$/
const STATION_RE = /^[A-Z][A-Z0-9]{3}$/
const TIME_RE = /^(\d{2})(\d{2})(\d{2})Z$/
const PERIOD_RE = /^(\d{2})(\d{2})\/(\d{2})(\d{2})$/
const FM_RE = /^FM(\d{2})(\d{2})(\d{2})$/
const PROB_RE = /^PROB(\d{2})$/

const toKt = (value: number, unit: CodedSpeedUnit): number =>
  unit === 'KT' ? value : unit === 'MPS' ? value / MPS_PER_KT : value / KMH_PER_KT

function parseWind(group: string, issues: ValidationIssue[], line: number | undefined): CodedSurfaceWind | null {
  const bad = (why: string): null => {
    issues.push({ line, field: 'windGroup', message: `wind group "${group}" ${why}` })
    return null
  }
  const m = WIND_RE.exec(group)
  if (!m) return bad('is malformed (expected dddff[Gff]KT, MPS or KMH, e.g. 27015G25KT)')
  const [, dir, plus, ff, gustPlus, gg, unitRaw] = m
  const unit = unitRaw as CodedSpeedUnit
  const variable = dir === 'VRB'
  const directionDeg = variable ? null : Number(dir)
  const rawSpeed = Number(ff)
  const rawGust = gg === undefined ? undefined : Number(gg)
  if (directionDeg !== null && directionDeg > 360) return bad(`has a direction above 360°`)
  if (ff!.length === 3 && rawSpeed < 100) return bad('has a three-figure speed below 100')
  if (directionDeg === 0 && rawSpeed > 0) return bad('has direction 000 with a speed (000 is for calm only)')
  const speedAtLeast = plus === 'P'
  const calm = rawSpeed === 0 && !speedAtLeast
  if (calm && rawGust !== undefined) {
    return bad('has a gust on a calm wind: a gust group needs a mean wind (WMO-No. 306, FM 15: gusts are reported by how much they exceed the mean speed)')
  }
  // P99KT / P49MPS: the speed is more than the figure given.
  const speedKt = toKt(speedAtLeast ? rawSpeed + 1 : rawSpeed, unit)
  // The same bound as a filed level (validate.ts): a coded 999 kt is a typing slip, not a wind.
  if (speedKt > MAX_SPEED_KT) return bad(`has a speed above ${MAX_SPEED_KT} kt`)
  const wind: CodedSurfaceWind = { group, directionDeg, variable, calm, speedKt, speedAtLeast, unit }
  if (rawGust !== undefined) {
    const gustAtLeast = gustPlus === 'P'
    if (!gustAtLeast && rawGust <= rawSpeed) return bad('has a gust not above the mean speed')
    wind.gustKt = toKt(gustAtLeast ? rawGust + 1 : rawGust, unit)
    if (wind.gustKt > MAX_SPEED_KT) return bad(`has a gust above ${MAX_SPEED_KT} kt`)
    wind.gustAtLeast = gustAtLeast
  }
  return wind
}

/** The UTC time nearest to `ref` with this day of month, hour and minute (hour 24 is midnight of the next day). */
function resolveTime(day: number, hour: number, minute: number, ref: Date): Date | null {
  if (day < 1 || day > 31 || hour > 24 || minute > 59 || (hour === 24 && minute > 0)) return null
  let best: Date | null = null
  for (const monthShift of [-1, 0, 1]) {
    const y = ref.getUTCFullYear()
    const mo = ref.getUTCMonth() + monthShift
    const probe = new Date(Date.UTC(y, mo, day))
    if (probe.getUTCDate() !== day) continue // no such day in that month
    const t = new Date(Date.UTC(y, mo, day, hour, minute))
    if (!best || Math.abs(t.getTime() - ref.getTime()) < Math.abs(best.getTime() - ref.getTime())) best = t
  }
  return best
}

interface Section {
  change: 'BASE' | 'FM' | 'BECMG' | 'TEMPO' | 'PROB' | 'TREND'
  group: string
  from: Date | null
  to: Date | null
  winds: CodedSurfaceWind[]
  shearLevels: CodedShearLevel[]
  runwayShear: CodedRunwayShear | null
  text: string[]
}

const newSection = (change: Section['change'], group: string, from: Date | null = null, to: Date | null = null): Section =>
  ({ change, group, from, to, winds: [], shearLevels: [], runwayShear: null, text: [] })

function levelsOf(wind: CodedSurfaceWind | null, shear: CodedShearLevel[], notes: string[]): LevelInput[] {
  const levels: LevelInput[] = []
  if (wind) {
    if (wind.directionDeg === null && !wind.calm) {
      notes.push(`Surface wind ${wind.group} has a variable direction: it gives no profile level.`)
    }
    else {
      const level: LevelInput = { heightM: CODED_SURFACE_HEIGHT_M, directionDeg: wind.directionDeg ?? 0, speedKt: wind.speedKt }
      if (wind.gustKt !== undefined) level.gustKt = wind.gustKt
      levels.push(level)
    }
    if (wind.speedAtLeast || wind.gustAtLeast) notes.push(`Surface wind ${wind.group} is coded as "more than": the figures are lower bounds.`)
  }
  for (const s of shear) levels.push({ heightFt: s.heightAglFt, directionDeg: s.directionDeg, speedKt: s.speedKt })
  return levels
}

export interface CodedReportOptions {
  /** The time to read day-of-month times against and to measure the report's age from (default: now). */
  now?: Date
}

/**
 * Reads the wind content of one METAR, SPECI or TAF line: station, observation (or issue) time and TAF validity,
 * the surface wind groups (VRB, calm, P99/P49, gusts, dddVddd; KT, MPS and KMH), TAF WShhh/dddffKT groups, runway
 * wind shear groups (WS Rnn, WS ALL RWY, WS LDG RWYnn, WS TKOF RWYnn), and the TAF periods FM and BECMG each with
 * their own wind; TEMPO and PROB groups and a METAR's trend are noted, not used. Remarks (after RMK) are not read.
 * A malformed group is a WindValidationError that names it; `lineNumber` (1-based) is put on every issue.
 */
export function parseCodedReport(line: string, lineNumber?: number, options: CodedReportOptions = {}): CodedReport {
  if (typeof line !== 'string' || line.trim() === '' || line.length > MAX_LINE_CHARS) {
    throw new WindValidationError([{ line: lineNumber, field: 'line', message: `a report line of 1 to ${MAX_LINE_CHARS} characters is needed` }])
  }
  const now = options.now instanceof Date && Number.isFinite(options.now.getTime()) ? options.now : new Date()
  const tokens = line.trim().toUpperCase().split(/\s+/).map(t => t.replace(/=+$/, '')).filter(t => t !== '')
  const issues: ValidationIssue[] = []
  const first = tokens[0]
  const kind: CodedReportKind = first === 'METAR' || first === 'SPECI' || first === 'TAF' ? first : 'unknown'

  // Header: type, AMD/COR, station, time, and for a TAF the validity.
  let i = kind === 'unknown' ? 0 : 1
  while (tokens[i] === 'AMD' || tokens[i] === 'COR') i++
  let station: string | null = null
  if (tokens[i] !== undefined && STATION_RE.test(tokens[i]!) && !TIME_RE.test(tokens[i]!) && !WIND_LIKE_RE.test(tokens[i]!)) station = tokens[i++]!
  let observedAt: Date | null = null
  const tm = tokens[i] === undefined ? null : TIME_RE.exec(tokens[i]!)
  if (tm) {
    observedAt = resolveTime(Number(tm[1]), Number(tm[2]), Number(tm[3]), now)
    if (!observedAt) issues.push({ line: lineNumber, field: 'timeGroup', message: `time group "${tokens[i]}" is not a day and time (ddhhmmZ)` })
    i++
  }
  let validFrom: Date | null = null
  let validTo: Date | null = null
  const readPeriod = (group: string, ref: Date): [Date, Date] | null => {
    const p = PERIOD_RE.exec(group)
    if (!p) return null
    const from = resolveTime(Number(p[1]), Number(p[2]), 0, ref)
    const to = from ? resolveTime(Number(p[3]), Number(p[4]), 0, new Date(from.getTime() + 12 * 3600_000)) : null
    if (!from || !to || to <= from) {
      issues.push({ line: lineNumber, field: 'periodGroup', message: `period "${group}" is not a valid from/to (ddhh/ddhh, the end after the start)` })
      return null
    }
    return [from, to]
  }
  if (kind === 'TAF' && tokens[i] !== undefined && PERIOD_RE.test(tokens[i]!)) {
    const period = readPeriod(tokens[i]!, observedAt ?? now)
    if (period) [validFrom, validTo] = period
    i++
  }

  const sections: Section[] = [newSection('BASE', '', kind === 'TAF' ? validFrom : observedAt)]
  let lastWasWind = false
  for (; i < tokens.length; i++) {
    const t = tokens[i]!
    if (t === 'RMK') break
    const wasWind = lastWasWind
    lastWasWind = false
    let section = sections[sections.length - 1]!

    // Change groups open a new section.
    const fm = FM_RE.exec(t)
    if (kind === 'TAF' && fm) {
      const at = resolveTime(Number(fm[1]), Number(fm[2]), Number(fm[3]), validFrom ?? observedAt ?? now)
      if (!at) issues.push({ line: lineNumber, field: 'changeGroup', message: `change group "${t}" is not a day and time (FMddhhmm)` })
      sections.push(newSection('FM', t, at))
      continue
    }
    if (t === 'BECMG' || t === 'TEMPO' || PROB_RE.test(t) || t === 'NOSIG') {
      if (kind !== 'TAF') {
        // A METAR's trend forecast: noted, not used.
        sections.push(newSection('TREND', t))
        continue
      }
      let group = t
      let change: Section['change'] = t === 'BECMG' ? 'BECMG' : t === 'TEMPO' ? 'TEMPO' : 'PROB'
      if (change === 'PROB' && tokens[i + 1] === 'TEMPO') group += ` ${tokens[++i]}`
      const next = tokens[i + 1]
      let from: Date | null = null
      let to: Date | null = null
      if (next !== undefined && PERIOD_RE.test(next)) {
        const period = readPeriod(next, validFrom ?? observedAt ?? now)
        if (period) [from, to] = period
        group += ` ${next}`
        i++
      }
      else {
        issues.push({ line: lineNumber, field: 'changeGroup', message: `change group "${group}" needs its period (ddhh/ddhh)` })
        change = 'TEMPO'
      }
      sections.push(newSection(change, group, from, to))
      section = sections[sections.length - 1]!
      continue
    }
    section.text.push(t)

    if (t === 'WS') {
      const next = tokens[i + 1]
      const phase = next === 'LDG' || next === 'TKOF' ? next : null
      const target = phase ? tokens[i + 2] : next
      const rw = target === undefined ? null : RUNWAY_RE.exec(target)
      section.runwayShear ??= { allRunways: false, runways: [], groups: [] }
      if (!phase && next === 'ALL' && tokens[i + 2] === 'RWY') {
        section.runwayShear.allRunways = true
        section.runwayShear.groups.push('WS ALL RWY')
        i += 2
      }
      else if (rw) {
        if (!section.runwayShear.runways.includes(rw[1]!)) section.runwayShear.runways.push(rw[1]!)
        section.runwayShear.groups.push(phase ? `WS ${phase} ${target}` : `WS ${target}`)
        i += phase ? 2 : 1
      }
      else {
        const shown = ['WS', next, phase ? target : undefined].filter(Boolean).join(' ')
        issues.push({ line: lineNumber, field: 'runwayShearGroup', message: `wind shear group "${shown}" is malformed (expected WS Rnn, WS ALL RWY, WS LDG RWYnn or WS TKOF RWYnn)` })
        i += (next === undefined ? 0 : 1) + (phase && target !== undefined ? 1 : 0)
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
      const unit = m[4] as CodedSpeedUnit
      if (directionDeg > 360) {
        issues.push({ line: lineNumber, field: 'shearGroup', message: `low-level wind shear group "${t}" has a direction above 360°` })
        continue
      }
      if (toKt(Number(m[3]), unit) > MAX_SPEED_KT) {
        issues.push({ line: lineNumber, field: 'shearGroup', message: `low-level wind shear group "${t}" has a speed above ${MAX_SPEED_KT} kt` })
        continue
      }
      section.shearLevels.push({ group: t, heightAglFt, heightAglM: heightAglFt * M_PER_FT, directionDeg, speedKt: toKt(Number(m[3]), unit), unit })
      continue
    }
    const v = VARIABLE_RE.exec(t)
    if (v) {
      const fromDeg = Number(v[1])
      const toDeg = Number(v[2])
      const prev = section.winds[section.winds.length - 1]
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
    if (WIND_LIKE_RE.test(t)) {
      const wind = parseWind(t, issues, lineNumber)
      if (wind) {
        section.winds.push(wind)
        lastWasWind = true
      }
    }
  }
  if (issues.length) throw new WindValidationError(issues)

  // Periods that give a wind: the opening conditions, each FM (everything replaced) and each BECMG that changes
  // the wind or the shear (what it does not change carries on). TEMPO, PROB and a METAR's trend are notes.
  const notes: string[] = []
  const periods: CodedPeriod[] = []
  const base = sections[0]!
  for (const s of sections) {
    if (s.change === 'TEMPO' || s.change === 'PROB' || s.change === 'TREND') {
      notes.push(`${s.group}${s.text.length ? ` ${s.text.join(' ')}` : ''}: ${s.change === 'TREND' ? 'trend forecast' : s.change === 'PROB' ? 'probability group' : 'temporary change'}, shown only, not used.`)
      continue
    }
    const previous = periods[periods.length - 1]
    if (s.change === 'BECMG' && !s.winds.length && !s.shearLevels.length && !s.runwayShear) continue
    const surfaceWind = s.winds[0] ?? (s.change === 'BECMG' ? previous?.surfaceWind ?? null : null)
    const shearLevels = s.shearLevels.length || s.change !== 'BECMG' ? s.shearLevels : previous?.shearLevels ?? []
    const runwayShear = s.runwayShear ?? (s.change === 'BECMG' ? previous?.runwayShear ?? null : null)
    const periodNotes: string[] = []
    if (s.change === 'BECMG' && s.from && s.to) periodNotes.push(`Changing gradually from ${s.from.toISOString()} to ${s.to.toISOString()}: taken from the start of the change.`)
    if (s.winds.length > 1) periodNotes.push(`Only the first wind group of the period (${s.winds[0]!.group}) is used.`)
    periods.push({
      change: s.change as CodedPeriod['change'],
      group: s.group,
      from: s.from ? s.from.toISOString() : null,
      to: null,
      surfaceWind,
      shearLevels,
      runwayShear,
      levels: levelsOf(surfaceWind, shearLevels, periodNotes),
      notes: periodNotes,
    })
  }
  for (let k = 0; k < periods.length; k++) {
    const nextFrom = periods[k + 1]?.from ?? null
    periods[k]!.to = nextFrom
      ?? (kind === 'TAF'
        ? validTo?.toISOString() ?? null
        : observedAt ? new Date(observedAt.getTime() + METAR_VALIDITY_MINUTES * 60_000).toISOString() : null)
  }

  const allWinds = sections.flatMap(s => s.winds)
  const surfaceWind = base.winds[0] ?? null
  const levels = levelsOf(surfaceWind, base.shearLevels, notes)
  const runwayShear = base.runwayShear ?? sections.find(s => s.runwayShear && s.change !== 'TREND')?.runwayShear ?? null
  return {
    kind,
    station,
    observedAt: observedAt ? observedAt.toISOString() : null,
    validFrom: validFrom ? validFrom.toISOString() : null,
    validTo: validTo ? validTo.toISOString() : null,
    ageMinutes: observedAt ? Math.floor((now.getTime() - observedAt.getTime()) / 60_000) : null,
    surfaceWind,
    laterWinds: allWinds.slice(surfaceWind ? 1 : 0),
    shearLevels: base.shearLevels,
    runwayShear,
    periods,
    levels,
    notes,
  }
}

/**
 * Checks of pasted coded reports against the airfield they are filed for: the station in each report and its age.
 * Plain functions. A warning here must be confirmed by the dispatcher before the profile is filed.
 */
import type { CodedReportSummary } from './import/coded'

/** A METAR older than this is stale (Veerline default, a setting: METARs are issued every 30 or 60 minutes). */
export const METAR_MAX_AGE_MINUTES = 90
/** A TAF issued longer ago than this has normally been replaced (TAFs are issued every 6 hours: common practice). */
export const TAF_MAX_AGE_MINUTES = 360

export interface CodedWarning {
  code: 'other-station' | 'no-station' | 'report-old' | 'report-future' | 'taf-expired' | 'no-time'
  line: number
  message: string
}

export interface CodedCheckSettings {
  station: string
  now: Date
  metarMaxAgeMinutes?: number
  tafMaxAgeMinutes?: number
}

export function codedReportWarnings(reports: CodedReportSummary[], settings: CodedCheckSettings): CodedWarning[] {
  const out: CodedWarning[] = []
  const metarMax = settings.metarMaxAgeMinutes ?? METAR_MAX_AGE_MINUTES
  const tafMax = settings.tafMaxAgeMinutes ?? TAF_MAX_AGE_MINUTES
  for (const r of reports) {
    const name = `${r.kind === 'unknown' ? 'Report' : r.kind} on line ${r.line}`
    if (!r.station) out.push({ code: 'no-station', line: r.line, message: `${name} names no station: check it is for ${settings.station}.` })
    else if (r.station !== settings.station) out.push({ code: 'other-station', line: r.line, message: `${name} is for ${r.station}, not ${settings.station} (this airfield's reporting station).` })
    if (r.ageMinutes === null) {
      out.push({ code: 'no-time', line: r.line, message: `${name} has no time group (ddhhmmZ): its age is unknown.` })
      continue
    }
    const max = r.kind === 'TAF' ? tafMax : metarMax
    if (r.ageMinutes < -10) out.push({ code: 'report-future', line: r.line, message: `${name} is dated ${-r.ageMinutes} minutes in the future (${r.observedAt}).` })
    else if (r.ageMinutes > max) out.push({ code: 'report-old', line: r.line, message: `${name} is ${formatAge(r.ageMinutes)} old (${r.observedAt}); more than ${formatAge(max)}.` })
    if (r.kind === 'TAF' && r.validTo && Date.parse(r.validTo) <= settings.now.getTime()) {
      out.push({ code: 'taf-expired', line: r.line, message: `${name} was valid until ${r.validTo}: its validity has ended.` })
    }
  }
  return out
}

function formatAge(minutes: number): string {
  if (minutes < 120) return `${minutes} minutes`
  const h = Math.floor(minutes / 60)
  const m = minutes % 60
  return m ? `${h} h ${m} min` : `${h} hours`
}

/**
 * The age limits in force: `VEERLINE_METAR_MAX_AGE_MINUTES` and `VEERLINE_TAF_MAX_AGE_MINUTES` (whole minutes,
 * 1 to 1440), else the defaults above. A value that is not such a number is ignored.
 */
export function codedAgeLimits(env: Record<string, string | undefined> = process.env): { metarMaxAgeMinutes: number, tafMaxAgeMinutes: number } {
  const read = (v: string | undefined, fallback: number) => {
    const n = Number(v)
    return v !== undefined && Number.isInteger(n) && n >= 1 && n <= 1440 ? n : fallback
  }
  return { metarMaxAgeMinutes: read(env.VEERLINE_METAR_MAX_AGE_MINUTES, METAR_MAX_AGE_MINUTES), tafMaxAgeMinutes: read(env.VEERLINE_TAF_MAX_AGE_MINUTES, TAF_MAX_AGE_MINUTES) }
}

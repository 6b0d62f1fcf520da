import type { Airfield } from '../../db/schema'
import { codedAgeLimits, codedReportWarnings } from './coded-check'
import { profileIssuesError } from './filing'
import { parseCodedLines } from './import/coded'

/**
 * Reads pasted report lines for the coded-report form, saving nothing: levels, periods, times and runway wind shear;
 * with an airfield, each report's station and age are checked against it. Unreadable lines are a 422 naming them.
 */
export function readCodedPaste(text: string, airfield: Airfield | null, now: Date = new Date()) {
  const result = parseCodedLines(text, now)
  if (result.issues.length) throw profileIssuesError(result.issues, 'Some report lines could not be read')
  const station = airfield ? airfield.reportingStation ?? airfield.code : null
  const warnings = station ? codedReportWarnings(result.reports, { station, now, ...codedAgeLimits() }) : []
  // The validity the form proposes: a METAR's hour from its observation, or the first TAF's period.
  const first = result.reports[0]
  const validity = first?.periods[0]?.from && first.periods[0].to ? { validFrom: first.periods[0].from, validTo: first.periods[0].to } : null
  return { ...result, station, warnings, validity }
}

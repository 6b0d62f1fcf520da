// Coded reports pasted by a dispatcher: each line a METAR/SPECI (surface wind) or a TAF (WShhh/dddffKT groups).
import { parseCodedReport, WindValidationError, type CodedPeriod, type CodedRunwayShear, type LevelInput } from '../../../../shared/wind'
import type { ImportIssue } from './csv'
import { M_PER_FT } from '../../../../shared/units'

export type CodedReportSummary = {
  line: number
  kind: string
  station: string | null
  observedAt: string | null
  validFrom: string | null
  validTo: string | null
  ageMinutes: number | null
  runwayShear: CodedRunwayShear | null
  periods: CodedPeriod[]
  /** The line as pasted. */
  text: string
  notes: string[]
}

export type CodedLevels = {
  levels: LevelInput[]
  lines: number[]
  reports: CodedReportSummary[]
  issues: ImportIssue[]
}

const heightKeyM = (l: LevelInput) => Math.round((l.heightM ?? (l.heightFt ?? 0) * M_PER_FT) * 100)

export function parseCodedLines(text: string, now: Date = new Date()): CodedLevels {
  const out: CodedLevels = { levels: [], lines: [], reports: [], issues: [] }
  const seen = new Map<number, number>()
  text.split(/\r\n|\n|\r/).forEach((raw, i) => {
    const line = i + 1
    if (raw.trim() === '') return
    try {
      const report = parseCodedReport(raw, line, { now })
      const notes = [...report.notes]
      for (const level of report.levels) {
        const key = heightKeyM(level)
        if (seen.has(key)) {
          notes.push(`A level at this height came already from line ${seen.get(key)}; this one is left out.`)
          continue
        }
        seen.set(key, line)
        out.levels.push(level)
        out.lines.push(line)
      }
      if (!report.levels.length) notes.push('No wind level in this line.')
      out.reports.push({
        line,
        kind: report.kind,
        station: report.station,
        observedAt: report.observedAt,
        validFrom: report.validFrom,
        validTo: report.validTo,
        ageMinutes: report.ageMinutes,
        runwayShear: report.runwayShear,
        periods: report.periods,
        text: raw.trim(),
        notes,
      })
    }
    catch (err) {
      if (!(err instanceof WindValidationError)) throw err
      for (const issue of err.issues) out.issues.push({ line, field: issue.field, message: issue.message })
    }
  })
  return out
}

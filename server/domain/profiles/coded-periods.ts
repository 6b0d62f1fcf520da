import type { Airfield } from '../../db/schema'
import type { ProfileLevelInput } from '#shared/utils/profile-schema'
import type { Tx } from '../../utils/db'
import { M_PER_FT } from '../../../shared/units'
import type { FieldIssue } from '../../utils/errors'
import { fileProfile, profileIssuesError, type FiledProfile, type FilingActor } from './filing'
import { parseCodedLines } from './import/coded'

const heightKeyCm = (l: { heightM?: number, heightFt?: number }) => Math.round((l.heightM ?? (l.heightFt ?? 0) * M_PER_FT) * 100)

/**
 * Files one profile per period of a pasted TAF (the opening conditions, each FM and each BECMG that changes the
 * wind), in the caller's transaction: each period's surface wind and WS levels, with the levels aloft the dispatcher
 * added (a period's own level wins at the same height), valid over the period. Each is one filing (fileProfile:
 * its own supersession and one alert evaluation). A refused period refuses them all: nothing is saved.
 */
export async function fileCodedPeriods(tx: Tx, { airfield, text, line, confirmWarnings, levelsAloft, notes, actor }: {
  airfield: Airfield
  text: string
  line?: number
  confirmWarnings?: boolean
  levelsAloft: ProfileLevelInput[]
  notes?: string
  actor: FilingActor
}): Promise<{ profiles: FiledProfile[], alertsRaised: number }> {
  const read = parseCodedLines(text)
  if (read.issues.length) {
    throw profileIssuesError(read.issues.map(i => ({ field: 'codedReport.text', line: i.line, message: i.message })), 'The reports could not be read')
  }
  const taf = read.reports.find(r => r.kind === 'TAF' && (line === undefined || r.line === line))
  if (!taf) {
    throw profileIssuesError([{ field: 'line', ...(line === undefined ? {} : { line }), message: line === undefined ? 'No TAF among the pasted lines' : `Line ${line} is not a TAF` }], 'No periods to file')
  }
  const filed: FiledProfile[] = []
  for (const [k, period] of taf.periods.entries()) {
    const name = period.group || 'opening conditions'
    if (!period.from || !period.to) {
      throw profileIssuesError([{ field: `periods[${k}]`, line: taf.line, message: `The period "${name}" has no readable time: check the TAF's validity group` }], 'The periods were not filed, nothing was saved')
    }
    const own = new Set(period.levels.map(heightKeyCm))
    const levels = [...period.levels, ...levelsAloft.filter(l => !own.has(heightKeyCm(l)))]
    try {
      filed.push(await fileProfile(tx, {
        airfield, actor, entryMethod: actor.token ? 'api' : 'coded',
        input: {
          validFrom: period.from, validTo: period.to, source: 'coded-report', heightReference: 'AGL',
          notes: [`TAF ${taf.station ?? ''} ${name}`.replace(/\s+/g, ' ').trim(), notes].filter(Boolean).join('; ').slice(0, 2000),
          levels, codedReport: { text, confirmWarnings, period: { line: taf.line, index: k } },
        },
        details: { tafPeriod: { line: taf.line, index: k, group: period.group } },
      }))
    }
    catch (err) {
      // Name the period in each issue, so the dispatcher sees which one was refused.
      const data = (err as { data?: { issues?: FieldIssue[] } }).data
      if (!data?.issues) throw err
      throw profileIssuesError(data.issues.map(i => ({ ...i, field: i.field === 'codedReport.confirmWarnings' ? i.field : `periods[${k}].${i.field}`, message: i.field === 'codedReport.confirmWarnings' ? i.message : `${name}: ${i.message}` })),
        'The periods were not filed, nothing was saved')
    }
  }
  return { profiles: filed, alertsRaised: filed.reduce((n, f) => n + f.alertsRaised, 0) }
}

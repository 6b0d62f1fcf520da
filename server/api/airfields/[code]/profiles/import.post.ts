import { z } from 'zod'
import type { FieldIssue } from '../../../../utils/errors'
import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { HEIGHT_REFERENCES, PROFILE_SOURCES } from '#shared/utils/profile-schema'
import { parseProfileCsv } from '../../../../domain/profiles/import/csv'
import { parseProfileJson } from '../../../../domain/profiles/import/json'
import { loadAirfield } from '../../../../domain/airfields/lookup'
import { fileProfile, profileIssuesError } from '../../../../domain/profiles/filing'
import { fileRows, inFileWords, previewImport } from '../../../../domain/profiles/import/preview'

// A CSV or JSON file as the raw body; the profile's header fields in the query (a JSON file may carry its own).
// mode=preview answers the parsed levels and every problem with its line and saves nothing; mode=file files
// the whole file in one transaction, or nothing (422 naming the lines).
const querySchema = z.object({
  format: z.enum(['csv', 'json'], { errorMap: () => ({ message: 'format must be csv or json' }) }),
  mode: z.enum(['preview', 'file']).default('preview'),
  validFrom: z.string().optional(),
  validTo: z.string().optional(),
  source: z.enum(PROFILE_SOURCES).optional(),
  heightReference: z.enum(HEIGHT_REFERENCES).optional(),
  notes: z.string().max(2000).optional(),
  fileName: z.string().max(200).optional(),
})

export default defineApiHandler(async (event) => {
  const actor = await requireFiler(event)
  const { code } = readParams(event, airfieldCodeParamSchema)
  const query = readQuery(event, querySchema)
  const text = await readLimitedText(event)
  const airfield = await loadAirfield(code)
  const { format, mode, fileName, ...given } = query
  const queryHeader = Object.fromEntries(Object.entries(given).filter(([, v]) => v !== undefined && v !== ''))

  const parsed = format === 'csv'
    ? { header: {}, ...parseProfileCsv(text) }
    : parseProfileJson(text)
  const input = { ...queryHeader, ...parsed.header, levels: parsed.levels }
  const lineOf = (index: number) => parsed.lines[index]

  if (mode === 'preview') {
    const { issues, warnings } = await previewImport(airfield, input, parsed.issues, lineOf)
    return { levels: parsed.levels, lines: parsed.lines, header: parsed.header, issues: inFileWords(issues, format, lineOf), warnings,
      ...fileRows(parsed.levels, parsed.lines, format) }
  }

  // Filing a file honours Idempotency-Key like the JSON route; the query (format and header fields) is part of it.
  const claim = idempotencyClaim(event, actor, text)
  if (parsed.issues.length) throw profileIssuesError(inFileWords(parsed.issues, format, lineOf), `The file was not filed, nothing was saved`)
  return onceForKey(event, claim, async () => {
    const filed = await transaction(async (tx) => {
      const answer = await fileProfile(tx, {
        airfield, input, actor, entryMethod: actor.token ? 'api' : 'file', lineOf, details: { format, fileName: fileName ?? null },
      })
      if (claim) await storeAnswer(tx, claim, 201, answer)
      return answer
    }).catch((err: { data?: { issues?: FieldIssue[] } }) => {
      // The file's own columns and lines, not the API's paths.
      if (err?.data?.issues) throw profileIssuesError(inFileWords(err.data.issues, format, lineOf), 'The file was not filed, nothing was saved')
      throw err
    })
    setResponseStatus(event, 201)
    return filed
  })
})

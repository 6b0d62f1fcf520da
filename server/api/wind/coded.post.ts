import { z } from 'zod'
import { parseCodedLines } from '../../domain/profiles/import/coded'
import { profileIssuesError } from '../../domain/profiles/filing'

const bodySchema = z.object({ text: z.string({ required_error: 'Paste one or more report lines' }).min(1, 'Paste one or more report lines').max(20_000, 'At most 20,000 characters') }).strict()

// Reads pasted METAR/SPECI/TAF lines into levels (METAR surface wind at 10 m, TAF WShhh/dddffKT groups), saving nothing.
export default defineApiHandler(async (event) => {
  await requireCapability(event, 'file-profile')
  const body = await readBodyWith(event, bodySchema)
  const result = parseCodedLines(body.text)
  if (result.issues.length) throw profileIssuesError(result.issues, 'Some report lines could not be read')
  return result
})

import { z } from 'zod'
import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { instantSchema } from '#shared/utils/input-schemas'
import { loadAirfield } from '../../../../domain/airfields/lookup'
import { supersessionPreview } from '../../../../domain/profiles/supersession-preview'

const querySchema = z.object({ validFrom: instantSchema('Valid from'), validTo: instantSchema('Valid to') })
  .refine(q => Date.parse(q.validTo) > Date.parse(q.validFrom), { path: ['validTo'], message: 'Valid to must be after valid from' })

// Before filing: which active profiles a profile valid over [validFrom, validTo) would supersede, and for which time.
export default defineApiHandler(async (event) => {
  await requireFiler(event)
  const { code } = readParams(event, airfieldCodeParamSchema)
  const query = readQuery(event, querySchema)
  const airfield = await loadAirfield(code)
  return { supersedes: await supersessionPreview(airfield, new Date(query.validFrom), new Date(query.validTo)) }
})

import { z } from 'zod'
import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { profileLevelSchema } from '#shared/utils/profile-schema'
import { loadAirfield } from '../../../../domain/airfields/lookup'
import { fileCodedPeriods } from '../../../../domain/profiles/coded-periods'

const bodySchema = z.object({
  text: z.string({ required_error: 'Paste the report lines' }).min(1, 'Paste the report lines').max(20_000, 'At most 20,000 characters'),
  line: z.number({ invalid_type_error: 'Line must be a number' }).int('Line must be a whole number').min(1, 'Line must be 1 or more').optional(),
  confirmWarnings: z.boolean({ invalid_type_error: 'Confirm must be true or false' }).optional(),
  levelsAloft: z.array(profileLevelSchema).max(200, 'At most 200 levels aloft').default([]),
  notes: z.string().max(1000, 'Notes: at most 1,000 characters').optional(),
}).strict()

// Files one coded-report profile per TAF period (opening conditions, FM, BECMG) in one transaction, or none.
export default defineApiHandler(async (event) => {
  const actor = await requireFiler(event)
  const { code } = readParams(event, airfieldCodeParamSchema)
  const body = await readBodyWith(event, bodySchema)
  const airfield = await loadAirfield(code)
  const answer = await transaction(tx => fileCodedPeriods(tx, { airfield, ...body, actor }))
  setResponseStatus(event, 201)
  return answer
})

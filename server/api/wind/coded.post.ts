import { z } from 'zod'
import { airfieldCodeSchema } from '#shared/utils/airfield-schema'
import { loadAirfield } from '../../domain/airfields/lookup'
import { readCodedPaste } from '../../domain/profiles/coded-paste'

const bodySchema = z.object({
  text: z.string({ required_error: 'Paste one or more report lines' }).min(1, 'Paste one or more report lines').max(20_000, 'At most 20,000 characters'),
  airfield: airfieldCodeSchema.optional(),
}).strict()

// Reads pasted METAR/SPECI/TAF lines into levels, periods, times and runway wind shear, saving nothing. With an
// airfield, each report's station and age are checked: the warnings must be confirmed before filing.
export default defineApiHandler(async (event) => {
  await requireCapability(event, 'file-profile')
  const body = await readBodyWith(event, bodySchema)
  const airfield = body.airfield ? await loadAirfield(body.airfield) : null
  return readCodedPaste(body.text, airfield)
})

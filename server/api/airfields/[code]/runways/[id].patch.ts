import { z } from 'zod'
import { airfieldCodeSchema, runwaySchema } from '#shared/utils/airfield-schema'
import { idSchema } from '#shared/utils/input-schemas'
import { replaceRunway } from '../../../../domain/airfields/edit'
import { loadAirfield } from '../../../../domain/airfields/lookup'

const paramsSchema = z.object({ code: airfieldCodeSchema, id: idSchema('runway id') })

// Replaces a runway's length and both ends (the ends are edited together so the pair stays consistent).
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-airfields')
  const { code, id } = readParams(event, paramsSchema)
  const body = await readBodyWith(event, runwaySchema)
  return replaceRunway(user, await loadAirfield(code), id, body)
})

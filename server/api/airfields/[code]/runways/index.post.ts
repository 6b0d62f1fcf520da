import { airfieldCodeParamSchema, runwaySchema } from '#shared/utils/airfield-schema'
import { addRunway } from '../../../../domain/airfields/edit'
import { loadAirfield } from '../../../../domain/airfields/lookup'

export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-airfields')
  const { code } = readParams(event, airfieldCodeParamSchema)
  const body = await readBodyWith(event, runwaySchema)
  const added = await addRunway(user, await loadAirfield(code), body)
  setResponseStatus(event, 201)
  return added
})

import { airfieldCodeParamSchema, airfieldUpdateSchema } from '#shared/utils/airfield-schema'
import { updateAirfield } from '../../domain/airfields/edit'

export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-airfields')
  const { code } = readParams(event, airfieldCodeParamSchema)
  const body = await readBodyWith(event, airfieldUpdateSchema)
  return { airfield: await updateAirfield(user, code, body) }
})

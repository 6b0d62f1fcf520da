import { airfieldCreateSchema } from '#shared/utils/airfield-schema'
import { createAirfield } from '../../domain/airfields/edit'

export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-airfields')
  const body = await readBodyWith(event, airfieldCreateSchema)
  const airfield = await createAirfield(user, body)
  setResponseStatus(event, 201)
  return { airfield }
})

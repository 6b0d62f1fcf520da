import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { airfieldDetail, profileStateOf } from '../../domain/airfields'
import { loadAirfield } from '../../domain/airfields/lookup'

export default defineApiHandler(async (event) => {
  await requireUser(event)
  const { code } = readParams(event, airfieldCodeParamSchema)
  const airfield = await loadAirfield(code)
  return { airfield: { ...(await airfieldDetail(airfield)), profileState: await profileStateOf(airfield.id) } }
})

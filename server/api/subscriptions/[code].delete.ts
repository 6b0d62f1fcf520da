import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { loadAirfield } from '../../domain/airfields/lookup'
import { unfollow } from '../../domain/alerts/subscriptions'

// Stops following an airfield.
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const { code } = readParams(event, airfieldCodeParamSchema)
  await unfollow(user.id, await loadAirfield(code))
  setResponseStatus(event, 204)
  return null
})

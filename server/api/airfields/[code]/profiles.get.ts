import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { profileListQuerySchema } from '#shared/utils/profile-schema'
import { loadAirfield } from '../../../domain/airfields/lookup'
import { listProfiles } from '../../../domain/profiles/records'

// The profiles of one airfield: filtered by a time range (validity overlapping it) and source, sorted, paged.
export default defineApiHandler(async (event) => {
  await requireUser(event)
  const { code } = readParams(event, airfieldCodeParamSchema)
  const query = readQuery(event, profileListQuerySchema)
  return listProfiles(await loadAirfield(code), query)
})

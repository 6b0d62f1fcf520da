import { z } from 'zod'
import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { loadAirfield } from '../../../domain/airfields/lookup'
import { fileProfile } from '../../../domain/profiles/filing'

// How a person entered it, for showing it back; a feed's filing is always 'api'.
const querySchema = z.object({ entry: z.enum(['table', 'file', 'coded', 'api']).default('api') })

// Files a profile as JSON: a dispatcher's or admin's session, or a feed's API token (Authorization: Bearer).
export default defineApiHandler(async (event) => {
  const actor = await requireFiler(event)
  const { code } = readParams(event, airfieldCodeParamSchema)
  const query = readQuery(event, querySchema)
  const { raw, value } = await readLimitedJson(event)
  const airfield = await loadAirfield(code)
  const claim = idempotencyClaim(event, actor, raw)
  return onceForKey(event, claim, async () => {
    const answer = await transaction(async (tx) => {
      const filed = await fileProfile(tx, { airfield, input: value, actor, entryMethod: actor.token ? 'api' : query.entry })
      if (claim) await storeAnswer(tx, claim, 201, filed)
      return filed
    })
    setResponseStatus(event, 201)
    return answer
  })
})

import { receiptQuerySchema } from '#shared/utils/briefing-schemas'
import { listReceipts } from '../../domain/briefings/receipts'
import { loadAirfield } from '../../domain/airfields/lookup'

// Who has read which briefing version. Dispatchers, safety officers and admins see everyone's; a pilot sees their own.
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'read-briefings')
  const query = readQuery(event, receiptQuerySchema)
  const airfieldId = query.airfield ? (await loadAirfield(query.airfield)).id : undefined
  const receipts = await listReceipts({
    airfieldId, profileId: query.profile, userId: user.role === 'pilot' ? user.id : undefined,
  })
  return { receipts }
})

import { receiptBodySchema } from '#shared/utils/briefing-schemas'
import { recordReceipt } from '../../domain/briefings/receipts'

// A pilot marks the briefing of one profile version as read. Marking it again changes nothing (200).
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'record-receipt')
  const body = await readBodyWith(event, receiptBodySchema, 'The read receipt is not valid')
  const result = await recordReceipt(user, body.profileId)
  setResponseStatus(event, result.created ? 201 : 200)
  return result
})

import { receiptQuerySchema } from '#shared/utils/briefing-schemas'
import { listReceipts } from '../../domain/briefings/receipts'
import { airfieldByCode } from '../../domain/profiles/analysis'

// Who has read which briefing version. Dispatchers, safety officers and admins see everyone's; a pilot sees their own.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'admin', 'dispatcher', 'pilot', 'safety')
  const query = await getValidatedQuery(event, receiptQuerySchema.safeParse)
  if (!query.success) throw validationError(query.error, 'The receipts query is not valid')
  let airfieldId: number | undefined
  if (query.data.airfield) {
    const airfield = await airfieldByCode(query.data.airfield)
    if (!airfield) throw createError({ statusCode: 404, statusMessage: `No airfield with the code ${query.data.airfield}` })
    airfieldId = airfield.id
  }
  const receipts = await listReceipts({
    airfieldId, profileId: query.data.profile, userId: user.role === 'pilot' ? user.id : undefined,
  })
  return { receipts }
})

import { z } from 'zod'
import { decimalIntSchema, pageSchema } from '#shared/utils/input-schemas'
import { mailboxView } from '../../domain/standins/mailbox'

const querySchema = z.object({
  to: z.string().trim().max(254).optional(),
  q: z.string().trim().max(254).optional(),
  deliveryId: z.string().trim().max(64).optional(),
  page: pageSchema,
  pageSize: decimalIntSchema('pageSize', 1, 200).optional(),
  limit: decimalIntSchema('limit', 1, 1000).optional(),
  reveal: z.enum(['0', '1', 'true', 'false']).optional(),
})

// The messages the local SMTP stand-in received, newest first, a page at a time. Admins only, and only where the
// stand-ins run. `to` is one exact recipient, `q` a part of a recipient's address, `deliveryId` the copies of one
// delivery; `limit` is the older name of pageSize.
export default defineApiHandler(async (event) => {
  const admin = await requireCapability(event, 'read-mailbox')
  const query = readQuery(event, querySchema)
  return mailboxView(admin, {
    to: query.to, q: query.q, deliveryId: query.deliveryId, page: query.page, pageSize: query.pageSize ?? query.limit ?? 50,
    reveal: query.reveal === '1' || query.reveal === 'true',
  })
})

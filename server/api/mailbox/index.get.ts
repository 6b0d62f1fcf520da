import { z } from 'zod'
import { decimalIntSchema } from '#shared/utils/input-schemas'
import { mailboxView } from '../../domain/standins/mailbox'

const querySchema = z.object({
  to: z.string().trim().max(254).optional(),
  deliveryId: z.string().trim().max(64).optional(),
  page: decimalIntSchema('page', 1, 100_000).default(1),
  pageSize: decimalIntSchema('pageSize', 1, 1000).optional(),
  limit: decimalIntSchema('limit', 1, 1000).default(200),
  reveal: z.enum(['0', '1', 'true', 'false']).optional(),
})

// The messages the local SMTP stand-in received, newest first, a page at a time (`pageSize`, or `limit`). Admins
// only, and only where the stand-ins run.
export default defineApiHandler(async (event) => {
  const admin = await requireCapability(event, 'read-mailbox')
  const query = readQuery(event, querySchema)
  return mailboxView(admin, { to: query.to, deliveryId: query.deliveryId, page: query.page, limit: query.pageSize ?? query.limit, reveal: query.reveal === '1' || query.reveal === 'true' })
})

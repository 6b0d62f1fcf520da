import { z } from 'zod'
import { decimalIntSchema } from '#shared/utils/input-schemas'

const querySchema = z.object({
  state: z.enum(['queued', 'sent', 'failed']).optional(),
  kind: z.enum(['alert-raised', 'alert-cleared', 'invitation', 'password-reset']).optional(),
  limit: decimalIntSchema('limit', 1, 1000).default(200),
})

// The outbox itself, newest first: every notice (alerts, invitations, resets) and how its delivery stands.
export default defineApiHandler(async (event) => {
  await requireCapability(event, 'read-alert-log')
  const query = readQuery(event, querySchema)
  const o = schema.outbox
  const rows = await useDB().select({ id: o.id, kind: o.kind, channel: o.channel, alertId: o.alertId, userId: o.userId, to: o.toAddress,
    subject: o.subject, state: o.state, attempts: o.attempts, lastError: o.lastError, nextAttemptAt: o.nextAttemptAt, sentAt: o.sentAt,
    sentBy: o.sentBy, createdAt: o.createdAt }).from(o)
    .where(and(query.state ? eq(o.state, query.state) : undefined, query.kind ? eq(o.kind, query.kind) : undefined))
    .orderBy(desc(o.id)).limit(query.limit)
  return { deliveries: rows }
})

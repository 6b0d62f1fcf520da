// The outbox worker: claims due rows with SELECT … FOR UPDATE SKIP LOCKED (so two app instances never take the same
// row), sends each while holding its lock, and records the outcome in the same transaction.
import { eq, inArray, schema, sql, transaction } from '../../utils/db'
import type { DB, Tx } from '../../utils/db'
import type { OutboxRow } from '../../db/schema'
import { nextDelayMs, retryPolicy, type RetryPolicy } from './backoff'
import { sendMail } from './mailer'
import { PushGoneError, PushRefusedError, sendPush } from './push'

export type Senders = {
  email: (row: OutboxRow) => Promise<void>
  push: (row: OutboxRow, tx: Tx) => Promise<void>
}

export function defaultSenders(db: DB): Senders {
  return {
    email: async (row) => {
      await sendMail({ to: row.toAddress!, subject: row.subject ?? '(no subject)', text: row.textBody ?? '', html: row.htmlBody,
        headers: { 'X-Veerline-Delivery': String(row.id), 'X-Veerline-Kind': row.kind } })
    },
    push: async (row, tx) => {
      const [device] = await tx.select().from(schema.pushSubscriptions).where(eq(schema.pushSubscriptions.id, row.pushSubscriptionId ?? 0))
      if (!device) throw new PushGoneError('the push subscription was removed')
      try {
        await sendPush(db, device, { ...row.pushPayload, deliveryId: row.id })
      }
      catch (err) {
        if (err instanceof PushGoneError) await tx.delete(schema.pushSubscriptions).where(eq(schema.pushSubscriptions.id, device.id))
        throw err
      }
    },
  }
}

/** One claim-and-send round; returns how many rows it handled (0 = nothing due). */
export async function runOutboxOnce(db: DB, senders: Senders, instanceId: string, policy: RetryPolicy = retryPolicy(), batch = 5) {
  // It sends inside the transaction, so a conflict is not repeated here (attempts: 1): the rows stay due.
  return transaction(async (tx) => {
    const [claimed] = await tx.execute(sql`SELECT id FROM outbox WHERE state = 'queued' AND next_attempt_at <= CURRENT_TIMESTAMP(3)
      ORDER BY id LIMIT ${batch} FOR UPDATE SKIP LOCKED`) as unknown as [{ id: number }[]]
    if (!claimed.length) return 0
    const rows = await tx.select().from(schema.outbox).where(inArray(schema.outbox.id, claimed.map(r => Number(r.id))))
    for (const row of rows) {
      const attempts = row.attempts + 1
      try {
        if (row.channel === 'email') await senders.email(row)
        else await senders.push(row, tx)
        const redacted = row.kind === 'invitation' || row.kind === 'password-reset'
        await tx.update(schema.outbox).set({
          state: 'sent', attempts, sentAt: new Date(), sentBy: instanceId, lastError: null, updatedAt: new Date(),
          // A sign-in link is not kept once it is on its way: only its hash stays, in user_tokens.
          ...(redacted ? { textBody: '(link removed after sending)', htmlBody: null } : {}),
        }).where(eq(schema.outbox.id, row.id))
      }
      catch (err) {
        const message = (err instanceof Error ? err.message : String(err)).slice(0, 1000)
        const delay = err instanceof PushGoneError || err instanceof PushRefusedError ? null : nextDelayMs(attempts, policy)
        await tx.update(schema.outbox).set({
          attempts, lastError: message, updatedAt: new Date(),
          ...(delay == null ? { state: 'failed' as const } : { nextAttemptAt: new Date(Date.now() + delay) }),
        }).where(eq(schema.outbox.id, row.id))
      }
    }
    return rows.length
  }, { db, attempts: 1 })
}

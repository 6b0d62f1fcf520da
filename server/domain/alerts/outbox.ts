// The transactional outbox: notices are written with the change that causes them (same transaction) and sent later
// by the worker (worker.ts). Enqueueing is idempotent through a unique dedupe key; many rows go in a few
// multi-row inserts. Each notice keeps its place in its fan-out (fan_seq), by which claims take them, so a later
// alert of another airfield goes ahead of the rest of a big fan-out.
import { randomUUID } from 'node:crypto'
import { and, eq, inArray, schema, sql } from '../../utils/db'
import type { DB, Tx } from '../../utils/db'
import { outboxPriority } from '../../db/schema'
import { alertTitle, renderAlertEmail, renderAlertPush, type AlertNoticeData } from './messages'
import { noticesQueued } from './queued'

type NewOutbox = Omit<typeof schema.outbox.$inferInsert, 'deliveryId' | 'priority'>

const INSERT_CHUNK = 200

export async function enqueue(tx: Tx | DB, rows: NewOutbox | NewOutbox[]) {
  const list = Array.isArray(rows) ? rows : [rows]
  for (let i = 0; i < list.length; i += INSERT_CHUNK) {
    const values = list.slice(i, i + INSERT_CHUNK).map((row, j) => ({
      ...row, deliveryId: randomUUID(), priority: outboxPriority[row.kind], fanSeq: i + j,
    }))
    // A second enqueue of the same notice (same dedupe key) changes nothing.
    await tx.insert(schema.outbox).values(values).onDuplicateKeyUpdate({ set: { dedupeKey: sql`dedupe_key` } })
  }
  noticesQueued(list.length)
}

export async function alertNoticeData(tx: Tx | DB, alertId: number, event: 'raised' | 'cleared', appUrl: string): Promise<AlertNoticeData & { raisedCount: number, airfieldId: number }> {
  const [row] = await tx.select({ alert: schema.alerts, airfield: schema.airfields, profile: schema.profiles })
    .from(schema.alerts)
    .innerJoin(schema.airfields, eq(schema.airfields.id, schema.alerts.airfieldId))
    .innerJoin(schema.profiles, eq(schema.profiles.id, schema.alerts.profileId))
    .where(eq(schema.alerts.id, alertId))
  if (!row) throw new Error(`alert ${alertId} not found`)
  const { alert, airfield, profile } = row
  return {
    event, appUrl, raisedCount: alert.raisedCount, airfieldId: airfield.id,
    airfield: { code: airfield.code, name: airfield.name },
    designator: alert.designator, kind: alert.kind, value: alert.value, limit: alert.limitValue, unit: alert.unit,
    excess: alert.excess, message: alert.message, clearReason: alert.clearReason,
    profile: { id: profile.id, validFrom: profile.validFrom, validTo: profile.validTo, source: profile.source },
  }
}

/** Queues the inbox entries, e-mails and pushes of one alert event for everyone subscribed to its airfield. */
export async function enqueueAlertNotices(tx: Tx, alertId: number, event: 'raised' | 'cleared', appUrl: string) {
  const d = await alertNoticeData(tx, alertId, event, appUrl)
  const subs = await tx.select({ sub: schema.alertSubscriptions, user: schema.users })
    .from(schema.alertSubscriptions)
    .innerJoin(schema.users, eq(schema.users.id, schema.alertSubscriptions.userId))
    .where(and(eq(schema.alertSubscriptions.airfieldId, d.airfieldId), eq(schema.users.disabled, false)))
  if (!subs.length) return
  const pushUsers = subs.filter(s => s.sub.push).map(s => s.user.id)
  const devices = pushUsers.length
    ? await tx.select().from(schema.pushSubscriptions).where(inArray(schema.pushSubscriptions.userId, pushUsers))
    : []
  const mail = renderAlertEmail(d)
  const push = renderAlertPush(d)
  const kind = event === 'raised' ? 'alert-raised' as const : 'alert-cleared' as const
  const stem = `alert:${alertId}:${event}:${d.raisedCount}`
  const title = alertTitle(d).slice(0, 300)
  const inbox: (typeof schema.alertInbox.$inferInsert)[] = []
  const notices: NewOutbox[] = []
  const airfieldId = d.airfieldId
  for (const { sub, user } of subs) {
    inbox.push({ userId: user.id, alertId, event, title })
    if (sub.email) {
      notices.push({ kind, channel: 'email', dedupeKey: `${stem}:email:${user.id}`, alertId, airfieldId, userId: user.id,
        toAddress: user.email, subject: mail.subject, textBody: mail.text, htmlBody: mail.html })
    }
    if (sub.push) {
      for (const device of devices.filter(x => x.userId === user.id)) {
        notices.push({ kind, channel: 'push', dedupeKey: `${stem}:push:${device.id}`, alertId, airfieldId, userId: user.id,
          pushSubscriptionId: device.id, subject: push.title, pushPayload: push })
      }
    }
  }
  for (let i = 0; i < inbox.length; i += INSERT_CHUNK) await tx.insert(schema.alertInbox).values(inbox.slice(i, i + INSERT_CHUNK))
  await enqueue(tx, notices)
}

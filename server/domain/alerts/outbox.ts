// The transactional outbox: notices are written with the change that causes them (same transaction) and sent later
// by the worker (worker.ts). Enqueueing is idempotent through a unique dedupe key.
import { and, eq, inArray, schema } from '../../utils/db'
import type { DB, Tx } from '../../utils/db'
import { alertTitle, renderAlertEmail, renderAlertPush, type AlertNoticeData } from './messages'

type NewOutbox = typeof schema.outbox.$inferInsert

export async function enqueue(tx: Tx | DB, row: NewOutbox) {
  // A second enqueue of the same notice (same dedupe key) changes nothing.
  await tx.insert(schema.outbox).values(row).onDuplicateKeyUpdate({ set: { dedupeKey: row.dedupeKey } })
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
  for (const { sub, user } of subs) {
    await tx.insert(schema.alertInbox).values({ userId: user.id, alertId, event, title })
    if (sub.email) {
      await enqueue(tx, { kind, channel: 'email', dedupeKey: `${stem}:email:${user.id}`, alertId, userId: user.id,
        toAddress: user.email, subject: mail.subject, textBody: mail.text, htmlBody: mail.html })
    }
    if (sub.push) {
      for (const device of devices.filter(x => x.userId === user.id)) {
        await enqueue(tx, { kind, channel: 'push', dedupeKey: `${stem}:push:${device.id}`, alertId, userId: user.id,
          pushSubscriptionId: device.id, subject: push.title, pushPayload: push })
      }
    }
  }
}

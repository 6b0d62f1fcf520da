import type { User } from '../../db/schema'
import { and, asc, desc, eq, inArray, schema, sql, useDB } from '../../utils/db'
import { recordAudit } from '../../utils/audit'
import { notFound } from '../../utils/errors'
import { outboxStatus } from './outbox-status'

export type AlertLogFilter = {
  airfieldId?: number
  state?: 'active' | 'cleared' | 'superseded' | 'expired'
  kind?: string
  /** 'failed': only alerts with a notice that failed for good (where the header's "not delivered" notice leads). */
  delivery?: 'failed'
  limit: number
  page?: number
}

/** How many alerts the log's filter matches (for paging). */
export async function countAlerts(filter: AlertLogFilter) {
  const a = schema.alerts
  const [row] = await useDB().select({ n: sql<number>`COUNT(*)` }).from(a).where(alertLogWhere(filter))
  return Number(row?.n ?? 0)
}

function alertLogWhere(filter: AlertLogFilter) {
  const a = schema.alerts
  const o = schema.outbox
  return and(filter.airfieldId ? eq(a.airfieldId, filter.airfieldId) : undefined, filter.state ? eq(a.state, filter.state) : undefined,
    filter.kind ? eq(a.kind, filter.kind) : undefined,
    filter.delivery === 'failed' ? sql`EXISTS (SELECT 1 FROM ${o} WHERE ${o.alertId} = ${a.id} AND ${o.state} = 'failed')` : undefined)
}

/** The alert log: every alert, newest first (a page of `limit`), with each of its deliveries (state, attempts, last error). */
export async function listAlerts(filter: AlertLogFilter) {
  const a = schema.alerts
  const rows = await useDB().select({ alert: a, airfieldCode: schema.airfields.code, profile: { validFrom: schema.profiles.validFrom, validTo: schema.profiles.validTo } })
    .from(a)
    .innerJoin(schema.airfields, eq(schema.airfields.id, a.airfieldId))
    .innerJoin(schema.profiles, eq(schema.profiles.id, a.profileId))
    .where(alertLogWhere(filter))
    .orderBy(desc(a.id))
    .limit(filter.limit)
    .offset(((filter.page ?? 1) - 1) * filter.limit)
  const o = schema.outbox
  const u = schema.users
  const ps = schema.pushSubscriptions
  // Who it was for, in words: the person's name, and for a push the device's label (none once the device is gone).
  const deliveries = rows.length
    ? await useDB().select({ id: o.id, deliveryId: o.deliveryId, alertId: o.alertId, kind: o.kind, channel: o.channel, to: o.toAddress, userId: o.userId,
        recipientName: u.name, recipientEmail: u.email, device: ps.label, state: o.state,
        attempts: o.attempts, lastError: o.lastError, nextAttemptAt: o.nextAttemptAt, sentAt: o.sentAt, sentBy: o.sentBy, createdAt: o.createdAt })
        .from(o).leftJoin(u, eq(u.id, o.userId)).leftJoin(ps, eq(ps.id, o.pushSubscriptionId))
        .where(inArray(o.alertId, rows.map(r => r.alert.id))).orderBy(asc(o.id))
    : []
  // Every attempt of every delivery: who claimed it and how it ended (a resend shows as a second attempt).
  const t = schema.outboxAttempts
  const tries = deliveries.length
    ? await useDB().select({ outboxId: t.outboxId, attempt: t.attempt, instance: t.instance, outcome: t.outcome, claimedAt: t.claimedAt, finishedAt: t.finishedAt, error: t.error })
        .from(t).where(inArray(t.outboxId, deliveries.map(d => d.id))).orderBy(asc(t.outboxId), asc(t.attempt), asc(t.id))
    : []
  const triesOf = new Map<number, typeof tries>()
  for (const x of tries) triesOf.set(x.outboxId, [...(triesOf.get(x.outboxId) ?? []), x])
  const withTries = deliveries.map(d => ({ ...d, tries: (triesOf.get(d.id) ?? []).map(({ outboxId: _, ...x }) => x) }))
  return rows.map(r => ({
    ...r.alert, airfieldCode: r.airfieldCode, validFrom: r.profile.validFrom, validTo: r.profile.validTo,
    deliveries: withTries.filter(d => d.alertId === r.alert.id),
  }))
}

/** How the queue stands for the alert log: backlog, due, being sent, retrying, the oldest due age and the failures. */
export function alertQueue() {
  return outboxStatus(useDB())
}

/** How many alert notices (raised or cleared) failed for good: the safety office's badge. */
export async function failedAlertNoticeCount() {
  const o = schema.outbox
  const [failed] = await useDB().select({ n: sql<number>`COUNT(*)` }).from(o)
    .where(and(eq(o.state, 'failed'), inArray(o.kind, ['alert-raised', 'alert-cleared'])))
  return Number(failed?.n ?? 0)
}

export type DeliveryFilter = {
  state?: 'queued' | 'sent' | 'failed'
  kind?: 'alert-raised' | 'alert-cleared' | 'invitation' | 'password-reset'
  limit: number
}

/** The outbox itself, newest first: every notice (alerts, invitations, resets) and how its delivery stands. */
export async function listDeliveries(filter: DeliveryFilter) {
  const o = schema.outbox
  return useDB().select({ id: o.id, deliveryId: o.deliveryId, kind: o.kind, channel: o.channel, alertId: o.alertId, userId: o.userId, to: o.toAddress,
    subject: o.subject, state: o.state, attempts: o.attempts, lastError: o.lastError, nextAttemptAt: o.nextAttemptAt, sentAt: o.sentAt,
    sentBy: o.sentBy, claimedBy: o.claimedBy, leaseUntil: o.leaseUntil, createdAt: o.createdAt }).from(o)
    .where(and(filter.state ? eq(o.state, filter.state) : undefined, filter.kind ? eq(o.kind, filter.kind) : undefined))
    .orderBy(desc(o.id)).limit(filter.limit)
}

/** Puts a failed delivery back in the queue, due now, with a fresh retry period (its attempts stay on record). */
export async function retryDelivery(user: User, id: number) {
  const o = schema.outbox
  const [result] = await useDB().update(o).set({ state: 'queued', nextAttemptAt: new Date(), firstAttemptAt: null, updatedAt: new Date() })
    .where(and(eq(o.id, id), eq(o.state, 'failed')))
  if (!result.affectedRows) throw notFound(`No failed delivery #${id}`)
  await recordAudit(useDB(), { user }, 'outbox.retry', 'outbox', id)
  return { id, state: 'queued' as const }
}

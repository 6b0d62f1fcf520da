import { and, desc, eq, inArray, isNull, schema, sql, useDB } from '../../utils/db'
import { notFound } from '../../utils/errors'

/** How many of the user's inbox entries are not acknowledged (the badge in the navigation). */
export async function unacknowledgedCount(userId: number) {
  const i = schema.alertInbox
  const [count] = await useDB().select({ n: sql<number>`COUNT(*)` }).from(i).where(and(eq(i.userId, userId), isNull(i.acknowledgedAt)))
  return Number(count?.n ?? 0)
}

export interface InboxFilter { airfieldId?: number, kind?: string, unacknowledged?: boolean, page: number, pageSize: number }

/** The user's alerts inbox, newest first, filtered and paged on the server, with the count not yet acknowledged. */
export async function inboxOf(userId: number, filter: InboxFilter = { page: 1, pageSize: 200 }) {
  const i = schema.alertInbox
  const a = schema.alerts
  const where = and(eq(i.userId, userId),
    filter.airfieldId != null ? eq(a.airfieldId, filter.airfieldId) : undefined,
    filter.kind ? eq(a.kind, filter.kind) : undefined,
    filter.unacknowledged ? isNull(i.acknowledgedAt) : undefined)
  const [items, [total], unacknowledged] = await Promise.all([
    useDB().select({
      id: i.id, event: i.event, title: i.title, acknowledgedAt: i.acknowledgedAt, createdAt: i.createdAt,
      alert: { id: a.id, designator: a.designator, kind: a.kind, value: a.value, limit: a.limitValue, unit: a.unit, excess: a.excess,
        message: a.message, state: a.state, clearReason: a.clearReason, profileId: a.profileId },
      airfieldCode: schema.airfields.code, airfieldName: schema.airfields.name,
      validFrom: schema.profiles.validFrom, validTo: schema.profiles.validTo,
    }).from(i)
      .innerJoin(a, eq(a.id, i.alertId))
      .innerJoin(schema.airfields, eq(schema.airfields.id, a.airfieldId))
      .innerJoin(schema.profiles, eq(schema.profiles.id, a.profileId))
      .where(where)
      .orderBy(desc(i.id))
      .limit(filter.pageSize)
      .offset((filter.page - 1) * filter.pageSize),
    useDB().select({ n: sql<number>`COUNT(*)` }).from(i).innerJoin(a, eq(a.id, i.alertId)).where(where),
    unacknowledgedCount(userId),
  ])
  return { items, unacknowledged, total: Number(total?.n ?? 0), page: filter.page, pageSize: filter.pageSize }
}

/**
 * Acknowledges many of the user's own entries at once: all of one airfield's, or those ids. Others' entries and ones
 * already acknowledged are left as they are; answers how many were acknowledged now.
 */
export async function acknowledgeInboxEntries(userId: number, which: { airfieldId: number } | { ids: number[] }) {
  const i = schema.alertInbox
  const a = schema.alerts
  const now = new Date()
  const scope = 'ids' in which
    ? inArray(i.id, which.ids)
    : inArray(i.alertId, useDB().select({ id: a.id }).from(a).where(eq(a.airfieldId, which.airfieldId)))
  const [result] = await useDB().update(i).set({ acknowledgedAt: now }).where(and(eq(i.userId, userId), isNull(i.acknowledgedAt), scope))
  return { acknowledged: result.affectedRows, acknowledgedAt: now, unacknowledged: await unacknowledgedCount(userId) }
}

/** Acknowledges one of the user's own inbox entries (404 for anyone else's); acknowledging twice keeps the first time. */
export async function acknowledgeInboxEntry(userId: number, id: number) {
  const i = schema.alertInbox
  const now = new Date()
  const [result] = await useDB().update(i).set({ acknowledgedAt: now }).where(and(eq(i.id, id), eq(i.userId, userId), isNull(i.acknowledgedAt)))
  if (result.affectedRows) return { id, acknowledgedAt: now }
  const [mine] = await useDB().select({ acknowledgedAt: i.acknowledgedAt }).from(i).where(and(eq(i.id, id), eq(i.userId, userId)))
  if (!mine) throw notFound(`No inbox entry #${id} of yours`)
  return { id, acknowledgedAt: mine.acknowledgedAt }
}

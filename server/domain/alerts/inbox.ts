import { and, desc, eq, isNull, schema, sql, useDB } from '../../utils/db'
import { notFound } from '../../utils/errors'

/** How many of the user's inbox entries are not acknowledged (the badge in the navigation). */
export async function unacknowledgedCount(userId: number) {
  const i = schema.alertInbox
  const [count] = await useDB().select({ n: sql<number>`COUNT(*)` }).from(i).where(and(eq(i.userId, userId), isNull(i.acknowledgedAt)))
  return Number(count?.n ?? 0)
}

/** The user's alerts inbox, newest first (the latest 200), with the count not yet acknowledged. */
export async function inboxOf(userId: number) {
  const i = schema.alertInbox
  const a = schema.alerts
  const [items, unacknowledged] = await Promise.all([
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
      .where(eq(i.userId, userId))
      .orderBy(desc(i.id))
      .limit(200),
    unacknowledgedCount(userId),
  ])
  return { items, unacknowledged }
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

import type { Airfield } from '../../db/schema'
import { and, eq, schema, sql, transaction, useDB } from '../../utils/db'
import { notFound } from '../../utils/errors'
import { alertNoticeData } from './outbox'
import { alertTitle } from './messages'

export type Channels = { email: boolean, push: boolean }

/** The user's subscriptions (airfields x channels), the airfields there are to choose from, and their push devices. */
export async function subscriptionsOf(userId: number) {
  const s = schema.alertSubscriptions
  const [subscriptions, airfields, devices] = await Promise.all([
    useDB().select({ airfieldCode: schema.airfields.code, airfieldName: schema.airfields.name, email: s.email, push: s.push })
      .from(s).innerJoin(schema.airfields, eq(schema.airfields.id, s.airfieldId)).where(eq(s.userId, userId)).orderBy(schema.airfields.code),
    useDB().select({ code: schema.airfields.code, name: schema.airfields.name }).from(schema.airfields).orderBy(schema.airfields.code),
    useDB().select({ n: sql<number>`COUNT(*)` }).from(schema.pushSubscriptions).where(eq(schema.pushSubscriptions.userId, userId)),
  ])
  return { subscriptions, airfields, pushDevices: Number(devices[0]?.n ?? 0) }
}

/**
 * Follows an airfield (or changes the channels). The in-app inbox always receives its alerts; the ones active now are
 * put there at once, each once: an alert already in the follower's inbox is not added again.
 */
export async function follow(userId: number, airfield: Airfield, channels: Channels) {
  const delivered = await transaction(async (tx) => {
    await tx.insert(schema.alertSubscriptions).values({ userId, airfieldId: airfield.id, ...channels })
      .onDuplicateKeyUpdate({ set: channels })
    const a = schema.alerts
    const i = schema.alertInbox
    const active = await tx.select({ id: a.id }).from(a)
      .where(and(eq(a.airfieldId, airfield.id), eq(a.state, 'active'),
        sql`NOT EXISTS (SELECT 1 FROM ${i} WHERE ${i.userId} = ${userId} AND ${i.alertId} = ${a.id})`))
      .orderBy(a.id)
      .for('update')
    for (const { id } of active) {
      const title = alertTitle(await alertNoticeData(tx, id, 'raised', '')).slice(0, 300)
      await tx.insert(i).values({ userId, alertId: id, event: 'raised', title })
    }
    return active.length
  })
  return { airfieldCode: airfield.code, ...channels, activeAlertsDelivered: delivered }
}

export async function unfollow(userId: number, airfield: Airfield) {
  const s = schema.alertSubscriptions
  const [result] = await useDB().delete(s).where(and(eq(s.userId, userId), eq(s.airfieldId, airfield.id)))
  if (!result.affectedRows) throw notFound(`You do not follow ${airfield.code}`)
}

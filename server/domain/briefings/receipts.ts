import type { User } from '../../db/schema'
import { and, desc, eq, schema, sql, transaction, useDB } from '../../utils/db'
import { recordAudit } from '../../utils/audit'
import { notFound } from '../../utils/errors'

/** The signed-in user's receipt for one profile version, if they marked it read. */
export async function receiptOf(userId: number, profileId: number) {
  const [row] = await useDB().select().from(schema.briefingReceipts)
    .where(and(eq(schema.briefingReceipts.userId, userId), eq(schema.briefingReceipts.profileId, profileId)))
  return row ? { id: row.id, profileId: row.profileId, readAt: row.readAt.toISOString() } : null
}

/**
 * Receipts with who read which version. A receipt is stale while its profile is not the one in force now: withdrawn,
 * or superseded now (wholly, or for this moment by a newer profile: supersession by time, the rule briefings use).
 */
export async function listReceipts(filter: { airfieldId?: number, profileId?: number, userId?: number }, now = new Date()) {
  const r = schema.briefingReceipts
  const p = schema.profiles
  const s = schema.profileSupersessions
  const conditions = [
    filter.airfieldId != null ? eq(r.airfieldId, filter.airfieldId) : undefined,
    filter.profileId != null ? eq(r.profileId, filter.profileId) : undefined,
    filter.userId != null ? eq(r.userId, filter.userId) : undefined,
  ].filter(c => c !== undefined)
  const rows = await useDB().select({
    id: r.id, readAt: r.readAt, profileId: r.profileId,
    userId: schema.users.id, userName: schema.users.name, userEmail: schema.users.email,
    airfieldCode: schema.airfields.code,
    profileStatus: p.status, validFrom: p.validFrom, validTo: p.validTo, supersededById: p.supersededById,
    supersededNow: sql<string | null>`(SELECT CONCAT_WS(',', ${s.supersededById}, ${s.fromAt}, ${s.toAt}) FROM ${s}
      WHERE ${s.profileId} = ${p.id} AND ${s.fromAt} <= ${now} AND ${s.toAt} > ${now} ORDER BY ${s.supersededById} DESC LIMIT 1)`,
  }).from(r)
    .innerJoin(schema.users, eq(schema.users.id, r.userId))
    .innerJoin(p, eq(p.id, r.profileId))
    .innerJoin(schema.airfields, eq(schema.airfields.id, r.airfieldId))
    .where(conditions.length ? and(...conditions) : undefined)
    .orderBy(desc(r.readAt), desc(r.id)).limit(500)
  return rows.map((row) => {
    const cover = supersededNowOf(row.supersededNow)
    const superseded = row.profileStatus === 'superseded' || cover !== null
    const byId = cover?.byId ?? row.supersededById
    return {
      id: row.id,
      readAt: row.readAt.toISOString(),
      profileId: row.profileId,
      airfield: row.airfieldCode,
      user: { id: row.userId, name: row.userName, email: row.userEmail },
      profile: { status: row.profileStatus, validFrom: row.validFrom.toISOString(), validTo: row.validTo.toISOString(),
        supersededById: row.supersededById },
      stale: row.profileStatus === 'withdrawn' || superseded,
      staleReason: row.profileStatus === 'withdrawn'
        ? `Profile ${row.profileId} has been withdrawn`
        : superseded
          ? `Profile ${row.profileId} has been superseded${byId ? ` by profile ${byId}` : ''}${cover ? ` from ${utcText(cover.from)} to ${utcText(cover.to)}` : ''}`
          : null,
    }
  })
}

const utcText = (d: Date) => `${d.toISOString().slice(0, 16).replace('T', ' ')}Z`

/** The record covering now, read back from its `id,from,to` text (MariaDB's DATETIME text is UTC here). */
function supersededNowOf(text: string | null): { byId: number, from: Date, to: Date } | null {
  if (!text) return null
  const [id, from, to] = text.split(',')
  const at = (x: string | undefined) => new Date(`${x!.replace(' ', 'T')}Z`)
  return { byId: Number(id), from: at(from), to: at(to) }
}

/** A pilot marks the briefing of one profile version as read; marking it again changes nothing (created: false). */
export async function recordReceipt(user: User, profileId: number) {
  const created = await transaction(async (tx) => {
    const [profile] = await tx.select().from(schema.profiles).where(eq(schema.profiles.id, profileId))
    if (!profile) throw notFound(`No profile with id ${profileId}`)
    const [existing] = await tx.select().from(schema.briefingReceipts)
      .where(and(eq(schema.briefingReceipts.userId, user.id), eq(schema.briefingReceipts.profileId, profileId)))
    if (existing) return false
    const [inserted] = await tx.insert(schema.briefingReceipts)
      .values({ userId: user.id, profileId, airfieldId: profile.airfieldId, readAt: new Date() }).$returningId()
    await recordAudit(tx, { user }, 'briefing.read', 'profile', profileId, { receiptId: inserted?.id, airfieldId: profile.airfieldId })
    return true
  })
  return { receipt: await receiptOf(user.id, profileId), created }
}

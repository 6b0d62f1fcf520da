import type { z } from 'zod'
import type { profileListQuerySchema } from '../../../shared/utils/profile-schema'
import type { Airfield, User } from '../../db/schema'
import { and, asc, desc, eq, gt, lt, schema, sql, transaction, useDB } from '../../utils/db'
import type { DB, Tx } from '../../utils/db'
import { recordAudit } from '../../utils/audit'
import { conflict, notFound } from '../../utils/errors'
import { evaluateAirfield } from '../alerts/evaluate'
import { publicProfile } from './filing'

async function profileWithLevels(db: DB | Tx, id: number) {
  const p = schema.profiles
  const s = schema.profileSupersessions
  const [row] = await db.select({ profile: p, code: schema.airfields.code }).from(p)
    .innerJoin(schema.airfields, eq(schema.airfields.id, p.airfieldId)).where(eq(p.id, id))
  if (!row) return null
  const [levels, superseded, periods] = await Promise.all([
    db.select().from(schema.profileLevels).where(eq(schema.profileLevels.profileId, id)).orderBy(asc(schema.profileLevels.seq)),
    db.select({ id: s.profileId }).from(s).where(eq(s.supersededById, id)),
    db.select().from(s).where(eq(s.profileId, id)).orderBy(asc(s.fromAt)),
  ])
  return publicProfile(row.profile, row.code, levels, [...new Set(superseded.map(x => x.id))],
    periods.map(x => ({ from: x.fromAt.toISOString(), to: x.toAt.toISOString(), byId: x.supersededById })))
}

/** One profile as filed, with its history links (what it superseded, what superseded it and for which time). */
export async function readProfile(id: number) {
  const profile = await profileWithLevels(useDB(), id)
  if (!profile) throw notFound(`No profile ${id}`)
  return profile
}

/** Withdraws an active profile with a reason (it stays, marked); the airfield is evaluated once in the same transaction. */
export async function withdrawProfile(user: User, id: number, reason: string) {
  const p = schema.profiles
  return transaction(async (tx) => {
    const [row] = await tx.select().from(p).where(eq(p.id, id)).for('update')
    if (!row) throw notFound(`No profile ${id}`)
    if (row.status !== 'active') throw conflict(`Profile ${id} is ${row.status}; only an active profile can be withdrawn`)
    await tx.update(p).set({ status: 'withdrawn', withdrawnAt: new Date(), withdrawnReason: reason, withdrawnByUserId: user.id })
      .where(and(eq(p.id, id), eq(p.status, 'active')))
    await recordAudit(tx, { user }, 'profile.withdraw', 'profile', id, { reason })
    await evaluateAirfield(tx, row.airfieldId, { trigger: 'profile.withdraw', actor: { user } })
    return (await profileWithLevels(tx, id))!
  })
}

/** The profiles of one airfield: filtered by a time range (validity overlapping it), source and status; sorted, paged. */
export async function listProfiles(airfield: Airfield, query: z.infer<typeof profileListQuerySchema>) {
  const { from, to, source, status, sort, order, page, pageSize } = query
  const p = schema.profiles
  const where = and(
    eq(p.airfieldId, airfield.id),
    from ? gt(p.validTo, new Date(from)) : undefined,
    to ? lt(p.validFrom, new Date(to)) : undefined,
    source ? eq(p.source, source) : undefined,
    status ? eq(p.status, status) : undefined,
  )
  const column = { validFrom: p.validFrom, validTo: p.validTo, createdAt: p.createdAt, source: p.source, status: p.status }[sort]
  const dir = order === 'asc' ? asc : desc
  const [rows, [total]] = await Promise.all([
    useDB().select({
      profile: p,
      levelCount: sql<number>`(SELECT COUNT(*) FROM ${schema.profileLevels} WHERE ${schema.profileLevels.profileId} = ${p.id})`,
      filedBy: schema.users.email,
    }).from(p).leftJoin(schema.users, eq(schema.users.id, p.filedByUserId))
      .where(where).orderBy(dir(column), dir(p.id)).limit(pageSize).offset((page - 1) * pageSize),
    useDB().select({ n: sql<number>`COUNT(*)` }).from(p).where(where),
  ])
  return {
    airfieldCode: airfield.code,
    profiles: rows.map(({ profile, levelCount, filedBy }) => {
      const { levels: _levels, ...summary } = publicProfile(profile, airfield.code, [])
      return { ...summary, levelCount: Number(levelCount), filedBy, briefingUrl: `/briefings/${airfield.code}?profile=${profile.id}` }
    }),
    page, pageSize, total: Number(total?.n ?? 0),
  }
}

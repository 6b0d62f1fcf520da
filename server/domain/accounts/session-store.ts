// Server-side sessions: the sealed cookie (nuxt-auth-utils) names a random session id; the user_sessions row decides
// whether it still holds. One query per request reads the session row and its user together.
import { createHash, randomBytes } from 'node:crypto'
import type { H3Event } from 'h3'
import { and, eq, lt, ne, or, schema, sql, useDB } from '../../utils/db'
import type { DB, Tx } from '../../utils/db'
import type { User } from '../../db/schema'
import { recordAudit } from '../../utils/audit'
import { sharedRead } from '../../utils/shared-read'
import { keepUnsealed, primeUnsealed, sealedSessionOf } from './unsealed-sessions'

/** How often a session's last-seen time (and its cookie's expiry) is moved on: at most one write a minute. */
export const SESSION_TOUCH_MS = 60_000

export type SessionLimits = { idleMs: number, absoluteMs: number }

function positive(value: string | undefined, fallback: number): number {
  const n = Number(value)
  return Number.isFinite(n) && n > 0 ? n : fallback
}

/** nuxt-auth-utils' session maxAge (NUXT_SESSION_MAX_AGE, seconds; nuxt.config.ts sets 7 days): the sealed cookie
 * stops unsealing then (h3 counts it from the sign-in), and the stored session ends with it. */
function configuredMaxAgeS(): number | undefined {
  return (useRuntimeConfig() as unknown as { session?: { maxAge?: number } }).session?.maxAge
}

/** The idle limit, VEERLINE_SESSION_IDLE_MINUTES (default 720 = 12 h), and the absolute one (default 7 days). */
export function sessionLimits(env: Record<string, string | undefined> = process.env, maxAgeS = configuredMaxAgeS()): SessionLimits {
  return {
    idleMs: positive(env.VEERLINE_SESSION_IDLE_MINUTES, 720) * 60_000,
    absoluteMs: positive(String(maxAgeS), 7 * 24 * 3600) * 1000,
  }
}

export const sessionIdHash = (sid: string) => createHash('sha256').update(sid).digest('hex')

export type SessionCheck
  = | { ok: true, touch: boolean, cookieMaxAgeS: number }
    | { ok: false, reason: 'ended' | 'disabled' | 'idle' | 'expired', message: string }

/** Whether a stored session still holds at `now`; pure, so the limits are tested without a clock. */
export function checkSession(row: { lastSeenAt: Date, expiresAt: Date } | undefined, user: Pick<User, 'disabled'> | undefined,
  now: number, limits: SessionLimits): SessionCheck {
  if (!row || !user) return { ok: false, reason: 'ended', message: 'Your session has ended; sign in again' }
  if (user.disabled) return { ok: false, reason: 'disabled', message: 'This account is disabled' }
  if (now >= row.expiresAt.getTime()) return { ok: false, reason: 'expired', message: 'Your session has reached its time limit; sign in again' }
  if (now - row.lastSeenAt.getTime() >= limits.idleMs) return { ok: false, reason: 'idle', message: 'Your session ended after a time without use; sign in again' }
  const touch = now - row.lastSeenAt.getTime() >= SESSION_TOUCH_MS
  const cookieMaxAgeS = Math.max(1, Math.floor(Math.min(limits.idleMs, row.expiresAt.getTime() - now) / 1000))
  return { ok: true, touch, cookieMaxAgeS }
}

export type SessionData = { user?: { id: number }, sid?: string }

/** Starts a session for the user: a new row and a new sealed cookie (replacing whatever the browser had). */
export async function startSession(event: H3Event, user: User, publicUser: Pick<User, 'id' | 'email' | 'name' | 'role'>, db: DB | Tx = useDB()) {
  const limits = sessionLimits()
  const now = Date.now()
  const sid = randomBytes(32).toString('base64url')
  // Rows past their end are of no use to anyone: drop this user's on the way.
  await db.delete(schema.userSessions).where(and(eq(schema.userSessions.userId, user.id),
    or(lt(schema.userSessions.expiresAt, new Date(now)), lt(schema.userSessions.lastSeenAt, new Date(now - limits.idleMs)))))
  await db.insert(schema.userSessions).values({ idHash: sessionIdHash(sid), userId: user.id, expiresAt: new Date(now + limits.absoluteMs) })
  await replaceUserSession(event, { user: publicUser, sid, signedInAt: new Date(now).toISOString() },
    { cookie: { maxAge: Math.floor(Math.min(limits.idleMs, limits.absoluteMs) / 1000) } })
}

/**
 * What the session read also says of the data: the data counter (every change any list or briefing shows) and the
 * reader's own receipt counter (server/db/schema/versions.ts), as texts. Read in the same statement as the session,
 * so a route holding an answer confirmed at these very counters knows nothing it shows changed since, on any
 * instance, and needs no query of its own. Nothing of what a route answers is read here: only two counters.
 */
export type ReadStamp = { data: string, reader: string }

/**
 * The signed-in user of this request and the read stamp, or a 401 (and a cleared cookie) when the session has ended.
 * One read: the session row joined to its user, with the two counters.
 */
export async function sessionUserOrEnd(event: H3Event): Promise<{ user: User, stamp: ReadStamp }> {
  const sealed = sealedSessionOf(event)
  const primed = sealed !== undefined && primeUnsealed(event, sealed)
  const session = await getUserSession(event) as SessionData
  if (sealed !== undefined && !primed) keepUnsealed(event, sealed)
  if (!session.user || typeof session.sid !== 'string') {
    if (session.user) await clearUserSession(event)
    throw createError({ statusCode: 401, statusMessage: 'Sign in first' })
  }
  const idHash = sessionIdHash(session.sid)
  const db = useDB()
  // Requests of the same session arriving together share one read that starts after all of them arrived
  // (server/utils/shared-read.ts): an ended session or a disabled user is refused on the very next request.
  const [found] = await sharedRead(`session:${idHash}`, () => db.select({
    user: schema.users,
    session: schema.userSessions,
    dataVersion: sql<number | string | null>`(SELECT dv.version FROM data_versions dv WHERE dv.id = 1)`,
    readerVersion: sql<number | string | null>`(SELECT rv.version FROM reader_versions rv WHERE rv.user_id = ${schema.users.id})`,
  })
    .from(schema.userSessions)
    .innerJoin(schema.users, eq(schema.users.id, schema.userSessions.userId))
    .where(eq(schema.userSessions.idHash, idHash)))
  const now = Date.now()
  const verdict = checkSession(found?.session, found?.user, now, sessionLimits())
  if (!verdict.ok) {
    await clearUserSession(event)
    throw createError({ statusCode: 401, statusMessage: verdict.message })
  }
  if (verdict.touch) {
    await db.update(schema.userSessions).set({ lastSeenAt: new Date(now) }).where(eq(schema.userSessions.idHash, idHash))
    await setUserSession(event, { seenAt: new Date(now).toISOString() }, { cookie: { maxAge: verdict.cookieMaxAgeS } })
  }
  return { user: found!.user, stamp: { data: String(found!.dataVersion ?? 0), reader: String(found!.readerVersion ?? 0) } }
}

/** Ends one session (the row of the cookie's session id); the cookie itself is cleared by the caller. */
export async function endSession(sid: string | undefined, db: DB | Tx = useDB()) {
  if (typeof sid !== 'string') return
  await db.delete(schema.userSessions).where(eq(schema.userSessions.idHash, sessionIdHash(sid)))
}

/** Ends every session of a user, except optionally the one with `keepSid`; answers how many ended. */
export async function endUserSessions(userId: number, db: DB | Tx = useDB(), keepSid?: string): Promise<number> {
  const where = keepSid
    ? and(eq(schema.userSessions.userId, userId), ne(schema.userSessions.idHash, sessionIdHash(keepSid)))
    : eq(schema.userSessions.userId, userId)
  const [result] = await db.delete(schema.userSessions).where(where) as unknown as [{ affectedRows: number }]
  return result?.affectedRows ?? 0
}

/** Ends every session of the account, this one included, and records it; the route then clears the cookie. */
export async function signOutEverywhere(user: User) {
  const ended = await endUserSessions(user.id)
  await recordAudit(useDB(), { user }, 'session.sign-out-everywhere', 'user', user.id, { ended })
  return ended
}

import type { H3Event } from 'h3'
import { can, rolesWith, type Capability } from '#shared/utils/capabilities'
import type { User } from '../db/schema'
import { sessionUserOrEnd, type ReadStamp } from '../domain/accounts/session-store'
import { eq, schema, useDB } from './db'
import type { FilingActor } from '../domain/profiles/filing'
import { sha256Hex } from '../domain/accounts/api-tokens'
import { forbidden, unauthorised } from './errors'

/**
 * Who is asking: the signed-in user as the database knows them now, through a session that still holds
 * (server/domain/accounts/session-store.ts). An ended, idle, expired or disabled user's session is cleared and
 * answered 401 on its next request. One query per request, and none more when a route asks twice.
 */
export async function requireUser(event: H3Event): Promise<User> {
  if (event.context.user) return event.context.user
  const { user, stamp } = await sessionUserOrEnd(event)
  event.context.user = user
  event.context.readStamp = stamp
  return user
}

/**
 * The read stamp of this request's session read (server/domain/accounts/session-store.ts), once requireUser has
 * passed; null otherwise (an API token, say): a kept answer is then checked by its own counters.
 */
export function readStampOf(event: H3Event): ReadStamp | null {
  return event.context.user ? (event.context.readStamp ?? null) : null
}

/** requireUser, then 403 unless the user's role has `capability` (shared/utils/capabilities.ts). */
export async function requireCapability(event: H3Event, capability: Capability): Promise<User> {
  const user = await requireUser(event)
  if (!can(user, capability)) {
    throw forbidden(`This needs the role ${rolesWith(capability).join(' or ')}; you are signed in as ${user.role}`)
  }
  return user
}

export function sessionUser(user: User) {
  return { id: user.id, email: user.email, name: user.name, role: user.role }
}

/**
 * Who may file profiles: a feed with `Authorization: Bearer <token>` (a live token whose maker may still file
 * profiles), else a signed-in user with 'file-profile'. 401 for a bad token or no session.
 */
export async function requireFiler(event: H3Event): Promise<FilingActor> {
  const header = getHeader(event, 'authorization')
  if (header === undefined) {
    const user = await requireCapability(event, 'file-profile')
    return { user, token: null }
  }
  const m = /^Bearer\s+(\S+)$/i.exec(header.trim())
  if (!m) throw unauthorised('The Authorization header must be "Bearer <API token>"')
  const db = useDB()
  const [token] = await db.select().from(schema.apiTokens).where(eq(schema.apiTokens.tokenHash, sha256Hex(m[1]!)))
  if (!token) throw unauthorised('This API token is not known')
  if (token.revokedAt) throw unauthorised(`This API token was revoked on ${token.revokedAt.toISOString()}`)
  const [user] = await db.select().from(schema.users).where(eq(schema.users.id, token.createdByUserId))
  if (!user || user.disabled || !can(user, 'file-profile')) {
    throw forbidden('The person who made this API token may no longer file profiles')
  }
  await db.update(schema.apiTokens).set({ lastUsedAt: new Date() }).where(eq(schema.apiTokens.id, token.id))
  return { user, token: { id: token.id, name: token.name } }
}

declare module 'h3' {
  interface H3EventContext {
    user?: User
    readStamp?: ReadStamp
  }
}

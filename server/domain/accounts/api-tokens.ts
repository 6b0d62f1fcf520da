import { createHash, randomBytes } from 'node:crypto'
import type { H3Event } from 'h3'
import type { FilingActor } from '../profiles/filing'
import { eq, schema, useDB } from '../../utils/db'
import { requireRole } from '../../utils/auth'

export const API_TOKEN_PREFIX = 'vlt_'

export function sha256Hex(text: string | Buffer): string {
  return createHash('sha256').update(text).digest('hex')
}

/** A new random token (shown once) and what is stored of it. */
export function newApiToken() {
  const token = `${API_TOKEN_PREFIX}${randomBytes(24).toString('base64url')}`
  return { token, tokenHash: sha256Hex(token), tokenPrefix: token.slice(0, 10) }
}

/**
 * Who may file profiles: a feed with `Authorization: Bearer <token>` (a live token whose maker is still an
 * enabled dispatcher or admin), else a signed-in dispatcher or admin. 401 for a bad token or no session.
 */
export async function requireFiler(event: H3Event): Promise<FilingActor> {
  const header = getHeader(event, 'authorization')
  if (header === undefined) {
    const user = await requireRole(event, 'dispatcher', 'admin')
    return { user, token: null }
  }
  const m = /^Bearer\s+(\S+)$/i.exec(header.trim())
  if (!m) throw createError({ statusCode: 401, statusMessage: 'The Authorization header must be "Bearer <API token>"' })
  const db = useDB()
  const [token] = await db.select().from(schema.apiTokens).where(eq(schema.apiTokens.tokenHash, sha256Hex(m[1]!)))
  if (!token) throw createError({ statusCode: 401, statusMessage: 'This API token is not known' })
  if (token.revokedAt) throw createError({ statusCode: 401, statusMessage: `This API token was revoked on ${token.revokedAt.toISOString()}` })
  const [user] = await db.select().from(schema.users).where(eq(schema.users.id, token.createdByUserId))
  if (!user || user.disabled || !['dispatcher', 'admin'].includes(user.role)) {
    throw createError({ statusCode: 403, statusMessage: 'The person who made this API token may no longer file profiles' })
  }
  await db.update(schema.apiTokens).set({ lastUsedAt: new Date() }).where(eq(schema.apiTokens.id, token.id))
  return { user, token: { id: token.id, name: token.name } }
}

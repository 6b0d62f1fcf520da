import { createHash, randomBytes } from 'node:crypto'
import type { User } from '../../db/schema'
import { and, desc, eq, isNull, schema, transaction, useDB } from '../../utils/db'
import { recordAudit } from '../../utils/audit'
import { notFound } from '../../utils/errors'

export const API_TOKEN_PREFIX = 'vlt_'

export function sha256Hex(text: string | Buffer): string {
  return createHash('sha256').update(text).digest('hex')
}

/** A new random token (shown once) and what is stored of it. */
export function newApiToken() {
  const token = `${API_TOKEN_PREFIX}${randomBytes(24).toString('base64url')}`
  return { token, tokenHash: sha256Hex(token), tokenPrefix: token.slice(0, 10) }
}

/** API tokens: a dispatcher sees their own, an admin sees all. The token itself is never shown again. */
export async function listApiTokens(user: User) {
  const t = schema.apiTokens
  const rows = await useDB().select({
    id: t.id, name: t.name, tokenPrefix: t.tokenPrefix, createdAt: t.createdAt, lastUsedAt: t.lastUsedAt, revokedAt: t.revokedAt,
    createdBy: schema.users.email,
  }).from(t).innerJoin(schema.users, eq(schema.users.id, t.createdByUserId))
    .where(user.role === 'admin' ? undefined : eq(t.createdByUserId, user.id))
    .orderBy(desc(t.createdAt))
  return rows.map(r => ({
    ...r, createdAt: r.createdAt.toISOString(), lastUsedAt: r.lastUsedAt?.toISOString() ?? null, revokedAt: r.revokedAt?.toISOString() ?? null,
  }))
}

/** Makes an API token for a feed. The answer carries the token once; only its SHA-256 is stored. */
export async function createApiToken(user: User, name: string) {
  const { token, tokenHash, tokenPrefix } = newApiToken()
  const id = await transaction(async (tx) => {
    const [row] = await tx.insert(schema.apiTokens).values({ name, tokenHash, tokenPrefix, createdByUserId: user.id }).$returningId()
    await recordAudit(tx, { user }, 'api-token.create', 'api-token', row!.id, { name, tokenPrefix })
    return row!.id
  })
  return { id, name, tokenPrefix, secret: token }
}

/** Revokes a token for good (the row stays, marked). A dispatcher revokes their own; an admin any. */
export async function revokeApiToken(user: User, id: number) {
  const t = schema.apiTokens
  const revoked = await transaction(async (tx) => {
    const scope = and(eq(t.id, id), isNull(t.revokedAt), user.role === 'admin' ? undefined : eq(t.createdByUserId, user.id))
    const [row] = await tx.select().from(t).where(scope).for('update')
    if (!row) return null
    const at = new Date()
    await tx.update(t).set({ revokedAt: at, revokedByUserId: user.id }).where(scope)
    await recordAudit(tx, { user }, 'api-token.revoke', 'api-token', id, { name: row.name, tokenPrefix: row.tokenPrefix })
    return { id, name: row.name, revokedAt: at.toISOString() }
  })
  if (!revoked) throw notFound(`No live API token ${id} of yours`)
  return revoked
}

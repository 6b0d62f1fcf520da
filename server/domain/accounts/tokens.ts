// Invitation and password-reset tokens: 32 random bytes sent once by e-mail; only their SHA-256 is stored.
// Single use (used_at), expiring (expires_at).
import { createHash, randomBytes } from 'node:crypto'
import { and, eq, gt, isNull, schema } from '../../utils/db'
import type { DB, Tx } from '../../utils/db'
import { enqueue } from '../alerts/outbox'
import { renderTokenEmail } from '../alerts/messages'

export type TokenPurpose = 'invitation' | 'password-reset'
export const TOKEN_LIFETIME_MS: Record<TokenPurpose, number> = { 'invitation': 72 * 3600_000, 'password-reset': 3600_000 }
export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex')
export const tokenShape = /^[A-Za-z0-9_-]{43}$/

/** Makes a token for the user and queues its e-mail in the same transaction. */
export async function issueToken(tx: Tx, purpose: TokenPurpose, user: { id: number, email: string, name: string }, appUrl: string, createdBy?: { id: number, name: string }) {
  const token = randomBytes(32).toString('base64url')
  const expiresAt = new Date(Date.now() + TOKEN_LIFETIME_MS[purpose])
  // A new link replaces any earlier unused one of the same purpose.
  await tx.update(schema.userTokens).set({ usedAt: new Date() })
    .where(and(eq(schema.userTokens.userId, user.id), eq(schema.userTokens.purpose, purpose), isNull(schema.userTokens.usedAt)))
  const [row] = await tx.insert(schema.userTokens).values({ userId: user.id, purpose, tokenHash: hashToken(token), expiresAt, createdByUserId: createdBy?.id ?? null }).$returningId()
  const link = `${appUrl.replace(/\/$/, '')}/${purpose === 'invitation' ? 'invite' : 'reset'}/${token}`
  const mail = renderTokenEmail(purpose, { name: user.name, link, expiresAt, invitedBy: createdBy?.name })
  await enqueue(tx, { kind: purpose, channel: 'email', dedupeKey: `token:${row!.id}`, userId: user.id, toAddress: user.email,
    subject: mail.subject, textBody: mail.text, htmlBody: mail.html })
  return { expiresAt }
}

/** The live token row and its user, or null when unknown, used or expired. */
export async function findLiveToken(db: DB | Tx, purpose: TokenPurpose, token: string, forUpdate = false) {
  if (!tokenShape.test(token)) return null
  const t = schema.userTokens
  const q = db.select({ token: t, user: schema.users }).from(t).innerJoin(schema.users, eq(schema.users.id, t.userId))
    .where(and(eq(t.tokenHash, hashToken(token)), eq(t.purpose, purpose), isNull(t.usedAt), gt(t.expiresAt, new Date())))
  const [row] = forUpdate ? await q.for('update') : await q
  return row ?? null
}

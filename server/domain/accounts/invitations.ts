import type { User } from '../../db/schema'
import { alias } from 'drizzle-orm/mysql-core'
import { and, desc, eq, isNull, schema, transaction, useDB } from '../../utils/db'
import type { Tx } from '../../utils/db'
import { recordAudit } from '../../utils/audit'
import { conflict, gone, notFound } from '../../utils/errors'
import { findLiveToken, hashToken, issueToken, tokenShape } from './tokens'

export type InvitationInput = { email: string, name: string, role: User['role'] }

/**
 * An admin invites a person by e-mail: the user is made without a password and the link lets them set one.
 * Inviting a pending person again takes the new name and role, so the answer is what is stored.
 */
export async function inviteUser(admin: User, input: InvitationInput, appUrl: string) {
  const { email, name, role } = input
  const result = await transaction(async (tx) => {
    const [existing] = await tx.select().from(schema.users).where(eq(schema.users.email, email)).for('update')
    if (existing?.passwordHash) throw conflict(`${email} already has an account`, [{ field: 'email', message: 'already has an account' }])
    let id = existing?.id
    if (!id) id = (await tx.insert(schema.users).values({ email, name, role, passwordHash: null }).$returningId())[0]!.id
    else await tx.update(schema.users).set({ name, role, disabled: false, updatedAt: new Date() }).where(eq(schema.users.id, id))
    const { expiresAt } = await issueToken(tx, 'invitation', { id: id!, email, name }, appUrl, admin)
    await recordAudit(tx, { user: admin }, existing ? 'user.reinvite' : 'user.invite', 'user', id!,
      existing ? { email, role, before: { name: existing.name, role: existing.role } } : { email, role })
    const [stored] = await tx.select().from(schema.users).where(eq(schema.users.id, id!))
    return { user: stored!, expiresAt }
  })
  const { user } = result
  return { user: { id: user.id, email: user.email, name: user.name, role: user.role }, expiresAt: result.expiresAt.toISOString() }
}

/**
 * What an invitation link is for, so the page can greet the person. A link that was issued but no longer works
 * (used, replaced by a newer one, revoked or expired) answers 410; a link never issued answers 404.
 */
export async function invitationFor(token: string) {
  const row = await findLiveToken(useDB(), 'invitation', token)
  if (row && !row.user.disabled) return { email: row.user.email, name: row.user.name, expiresAt: row.token.expiresAt.toISOString() }
  if (row || (tokenShape.test(token) && (await useDB().select({ id: schema.userTokens.id }).from(schema.userTokens)
    .where(and(eq(schema.userTokens.tokenHash, hashToken(token)), eq(schema.userTokens.purpose, 'invitation')))).length)) {
    throw gone('This invitation link is not valid any more (used, replaced by a newer one, withdrawn or expired); ask an administrator for a new one')
  }
  throw notFound('This invitation link is not valid (unknown); check the link or ask an administrator for a new one')
}

/**
 * The invitations still waiting: people without a password whose latest invitation link is unused. Newest first;
 * an expired one stays listed (marked) so an admin can send a fresh link.
 */
export async function listPendingInvitations(now = new Date()) {
  const t = schema.userTokens
  const u = schema.users
  const inviter = alias(schema.users, 'inviter')
  const rows = await useDB().select({
    tokenId: t.id, userId: u.id, email: u.email, name: u.name, role: u.role, sentAt: t.createdAt, expiresAt: t.expiresAt,
    invitedByName: inviter.name, invitedByEmail: inviter.email,
  }).from(t)
    .innerJoin(u, eq(u.id, t.userId))
    .leftJoin(inviter, eq(inviter.id, t.createdByUserId))
    .where(and(eq(t.purpose, 'invitation'), isNull(t.usedAt), isNull(u.passwordHash), eq(u.disabled, false)))
    .orderBy(desc(t.createdAt), desc(t.id))
  return rows.map(r => ({
    userId: r.userId, email: r.email, name: r.name, role: r.role,
    invitedBy: r.invitedByName ? { name: r.invitedByName, email: r.invitedByEmail } : null,
    sentAt: r.sentAt.toISOString(), expiresAt: r.expiresAt.toISOString(), expired: r.expiresAt <= now,
  }))
}

/** The invited person, locked, or 404 when there is no pending invitation for them. */
async function pendingInvitee(tx: Tx, userId: number) {
  const [user] = await tx.select().from(schema.users).where(eq(schema.users.id, userId)).for('update')
  if (!user || user.passwordHash || user.disabled) throw notFound(`There is no pending invitation for user ${userId}`)
  const [token] = await tx.select({ id: schema.userTokens.id }).from(schema.userTokens)
    .where(and(eq(schema.userTokens.userId, userId), eq(schema.userTokens.purpose, 'invitation'), isNull(schema.userTokens.usedAt)))
  if (!token) throw notFound(`There is no pending invitation for ${user.email}`)
  return user
}

/** Sends a new link; the earlier one stops working at once (issueToken marks it used). */
export async function resendInvitation(admin: User, userId: number, appUrl: string) {
  const { user, expiresAt } = await transaction(async (tx) => {
    const user = await pendingInvitee(tx, userId)
    const { expiresAt } = await issueToken(tx, 'invitation', user, appUrl, admin)
    await recordAudit(tx, { user: admin }, 'invitation.resend', 'user', user.id, { email: user.email, expiresAt: expiresAt.toISOString() })
    return { user, expiresAt }
  })
  return { user: { id: user.id, email: user.email, name: user.name, role: user.role }, expiresAt: expiresAt.toISOString() }
}

/** Withdraws the invitation: its link stops working and the account stays disabled (inviting again enables it). */
export async function revokeInvitation(admin: User, userId: number) {
  const user = await transaction(async (tx) => {
    const user = await pendingInvitee(tx, userId)
    await tx.update(schema.userTokens).set({ usedAt: new Date() })
      .where(and(eq(schema.userTokens.userId, userId), eq(schema.userTokens.purpose, 'invitation'), isNull(schema.userTokens.usedAt)))
    await tx.update(schema.users).set({ disabled: true, updatedAt: new Date() }).where(eq(schema.users.id, userId))
    await recordAudit(tx, { user: admin }, 'invitation.revoke', 'user', user.id, { email: user.email })
    return user
  })
  return { user: { id: user.id, email: user.email, name: user.name, role: user.role }, revoked: true }
}

import type { User } from '../../db/schema'
import { eq, schema, transaction, useDB } from '../../utils/db'
import { recordAudit } from '../../utils/audit'
import { conflict, notFound } from '../../utils/errors'
import { findLiveToken, issueToken } from './tokens'

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
    else await tx.update(schema.users).set({ name, role, updatedAt: new Date() }).where(eq(schema.users.id, id))
    const { expiresAt } = await issueToken(tx, 'invitation', { id: id!, email, name }, appUrl, admin)
    await recordAudit(tx, { user: admin }, existing ? 'user.reinvite' : 'user.invite', 'user', id!,
      existing ? { email, role, before: { name: existing.name, role: existing.role } } : { email, role })
    const [stored] = await tx.select().from(schema.users).where(eq(schema.users.id, id!))
    return { user: stored!, expiresAt }
  })
  const { user } = result
  return { user: { id: user.id, email: user.email, name: user.name, role: user.role }, expiresAt: result.expiresAt.toISOString() }
}

/** What an invitation link is for, so the page can greet the person; 404 when used, expired or unknown. */
export async function invitationFor(token: string) {
  const row = await findLiveToken(useDB(), 'invitation', token)
  if (!row) throw notFound('This invitation link is not valid any more (used, expired or unknown); ask an administrator for a new one')
  return { email: row.user.email, name: row.user.name, expiresAt: row.token.expiresAt.toISOString() }
}

import type { z } from 'zod'
import type { createUserSchema, updateUserSchema } from '../../../shared/utils/schemas'
import type { User } from '../../db/schema'
import { eq, schema, sql, transaction, useDB } from '../../utils/db'
import { recordAudit } from '../../utils/audit'
import { conflict, notFound } from '../../utils/errors'
import { endUserSessions } from './session-store'

/** A user as the Users page shows them (never the password hash). */
export function userView(u: Pick<User, 'id' | 'email' | 'name' | 'role' | 'disabled'>) {
  return { id: u.id, email: u.email, name: u.name, role: u.role, disabled: u.disabled }
}

export async function listUsers() {
  const u = schema.users
  const rows = await useDB().select({
    id: u.id, email: u.email, name: u.name, role: u.role, disabled: u.disabled,
    hasPassword: sql<boolean>`${u.passwordHash} IS NOT NULL`, createdAt: u.createdAt,
  }).from(u).orderBy(u.email)
  return rows.map(r => ({ ...r, hasPassword: Boolean(r.hasPassword) }))
}

const emailTaken = (email: string) => conflict(`A user with the e-mail ${email} already exists`, [{ field: 'email', message: 'already in use' }])

/** Makes an account with an initial password. */
export async function createUser(admin: User, input: z.infer<typeof createUserSchema>) {
  const { email, name, role, password } = input
  const [existing] = await useDB().select({ id: schema.users.id }).from(schema.users).where(eq(schema.users.email, email))
  if (existing) throw emailTaken(email)
  const passwordHash = await hashPassword(password)
  const id = await transaction(async (tx) => {
    const [row] = await tx.insert(schema.users).values({ email, name, role, passwordHash }).$returningId()
    await recordAudit(tx, { user: admin }, 'user.create', 'user', row!.id, { email, role })
    return row!.id
  }).catch((err) => {
    if (isDuplicateKeyError(err)) throw emailTaken(email)
    throw err
  })
  return userView({ id, email, name, role, disabled: false })
}

/** Renames, re-roles or disables an account; a new role or a disabled account ends its sessions. */
export async function updateUser(admin: User, id: number, change: z.infer<typeof updateUserSchema>) {
  if (id === admin.id && (change.disabled || (change.role && change.role !== 'admin'))) {
    throw conflict('You cannot disable yourself or remove your own admin role')
  }
  const user = await transaction(async (tx) => {
    const [before] = await tx.select().from(schema.users).where(eq(schema.users.id, id)).for('update')
    if (!before) return null
    await tx.update(schema.users).set({ ...change, updatedAt: new Date() }).where(eq(schema.users.id, id))
    // A new role or a disabled account ends the person's sessions: they sign in again under the new terms.
    if ((change.role !== undefined && change.role !== before.role) || change.disabled === true) await endUserSessions(id, tx)
    await recordAudit(tx, { user: admin }, 'user.update', 'user', id, {
      before: { name: before.name, role: before.role, disabled: before.disabled }, after: change,
    })
    return { ...before, ...change }
  })
  if (!user) throw notFound(`No user with id ${id}`)
  return userView(user)
}

import { idParamSchema, updateUserSchema } from '#shared/utils/schemas'
import { endUserSessions } from '../../domain/accounts/session-store'

export default defineApiHandler(async (event) => {
  const admin = await requireCapability(event, 'manage-users')
  const { id } = readParams(event, idParamSchema)
  const body = await readBodyWith(event, updateUserSchema)
  const change = body
  if (id === admin.id && (change.disabled || (change.role && change.role !== 'admin'))) {
    throw createError({ statusCode: 409, statusMessage: 'You cannot disable yourself or remove your own admin role' })
  }

  const user = await useDB().transaction(async (tx) => {
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
  if (!user) throw createError({ statusCode: 404, statusMessage: `No user with id ${id}` })
  return { user: { id: user.id, email: user.email, name: user.name, role: user.role, disabled: user.disabled } }
})

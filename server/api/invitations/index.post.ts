import { z } from 'zod'
import { emailSchema, roleSchema } from '#shared/utils/schemas'
import { issueToken } from '../../domain/accounts/tokens'

const bodySchema = z.object({ email: emailSchema, name: z.string().trim().min(1, 'Name is required').max(120), role: roleSchema })

// An admin invites a person by e-mail: the user is made without a password and the link lets them set one.
export default defineApiHandler(async (event) => {
  const admin = await requireCapability(event, 'manage-users')
  const body = await readBodyWith(event, bodySchema, 'The invitation was not sent')
  const { email, name, role } = body
  const appUrl = process.env.NUXT_PUBLIC_APP_URL || useRuntimeConfig().public.appUrl
  const result = await useDB().transaction(async (tx) => {
    const [existing] = await tx.select().from(schema.users).where(eq(schema.users.email, email)).for('update')
    if (existing?.passwordHash) throw createError({ statusCode: 409, statusMessage: `${email} already has an account`, data: { issues: [{ field: 'email', message: 'already has an account' }] } })
    let id = existing?.id
    if (!id) id = (await tx.insert(schema.users).values({ email, name, role, passwordHash: null }).$returningId())[0]!.id
    // Inviting a pending person again takes the new name and role, so the answer is what is stored.
    else await tx.update(schema.users).set({ name, role, updatedAt: new Date() }).where(eq(schema.users.id, id))
    const { expiresAt } = await issueToken(tx, 'invitation', { id: id!, email, name }, appUrl, admin)
    await recordAudit(tx, { user: admin }, existing ? 'user.reinvite' : 'user.invite', 'user', id!,
      existing ? { email, role, before: { name: existing.name, role: existing.role } } : { email, role })
    const [stored] = await tx.select().from(schema.users).where(eq(schema.users.id, id!))
    return { user: stored!, expiresAt }
  })
  setResponseStatus(event, 201)
  const { user } = result
  return { user: { id: user.id, email: user.email, name: user.name, role: user.role }, expiresAt: result.expiresAt.toISOString() }
})

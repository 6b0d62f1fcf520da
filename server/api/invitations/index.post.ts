import { z } from 'zod'
import { emailSchema, roleSchema } from '#shared/utils/schemas'
import { issueToken } from '../../domain/accounts/tokens'

const bodySchema = z.object({ email: emailSchema, name: z.string().trim().min(1, 'Name is required').max(120), role: roleSchema })

// An admin invites a person by e-mail: the user is made without a password and the link lets them set one.
export default defineEventHandler(async (event) => {
  const admin = await requireRole(event, 'admin')
  const body = await readValidatedBody(event, bodySchema.safeParse)
  if (!body.success) throw validationError(body.error, 'The invitation was not sent')
  const { email, name, role } = body.data
  const appUrl = process.env.NUXT_PUBLIC_APP_URL || useRuntimeConfig().public.appUrl
  const result = await useDB().transaction(async (tx) => {
    const [existing] = await tx.select().from(schema.users).where(eq(schema.users.email, email)).for('update')
    if (existing?.passwordHash) throw createError({ statusCode: 409, statusMessage: `${email} already has an account`, data: { issues: [{ field: 'email', message: 'already has an account' }] } })
    let id = existing?.id
    if (!id) id = (await tx.insert(schema.users).values({ email, name, role, passwordHash: null }).$returningId())[0]!.id
    const { expiresAt } = await issueToken(tx, 'invitation', { id: id!, email, name }, appUrl, admin)
    await recordAudit(tx, { user: admin }, existing ? 'user.reinvite' : 'user.invite', 'user', id!, { email, role })
    return { id: id!, expiresAt }
  })
  setResponseStatus(event, 201)
  return { user: { id: result.id, email, name, role }, expiresAt: result.expiresAt.toISOString() }
})

import { createUserSchema } from '#shared/utils/schemas'

export default defineApiHandler(async (event) => {
  const admin = await requireCapability(event, 'manage-users')
  const body = await readBodyWith(event, createUserSchema)
  const { email, name, role, password } = body

  const [existing] = await useDB().select({ id: schema.users.id }).from(schema.users).where(eq(schema.users.email, email))
  if (existing) throw createError({ statusCode: 409, statusMessage: `A user with the e-mail ${email} already exists`, data: { issues: [{ field: 'email', message: 'already in use' }] } })

  const passwordHash = await hashPassword(password)
  const id = await useDB().transaction(async (tx) => {
    const [row] = await tx.insert(schema.users).values({ email, name, role, passwordHash }).$returningId()
    await recordAudit(tx, { user: admin }, 'user.create', 'user', row!.id, { email, role })
    return row!.id
  })
  setResponseStatus(event, 201)
  return { user: { id, email, name, role, disabled: false } }
})

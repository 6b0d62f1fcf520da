export default defineApiHandler(async (event) => {
  await requireCapability(event, 'manage-users')
  const rows = await useDB().select({
    id: schema.users.id,
    email: schema.users.email,
    name: schema.users.name,
    role: schema.users.role,
    disabled: schema.users.disabled,
    hasPassword: sql<boolean>`${schema.users.passwordHash} IS NOT NULL`,
    createdAt: schema.users.createdAt,
  }).from(schema.users).orderBy(schema.users.email)
  return { users: rows.map(r => ({ ...r, hasPassword: Boolean(r.hasPassword) })) }
})

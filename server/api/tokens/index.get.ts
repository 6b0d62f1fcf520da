// API tokens: a dispatcher sees their own, an admin sees all. The token itself is never shown again.
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-tokens')
  const t = schema.apiTokens
  const rows = await useDB().select({
    id: t.id, name: t.name, tokenPrefix: t.tokenPrefix, createdAt: t.createdAt, lastUsedAt: t.lastUsedAt, revokedAt: t.revokedAt,
    createdBy: schema.users.email,
  }).from(t).innerJoin(schema.users, eq(schema.users.id, t.createdByUserId))
    .where(user.role === 'admin' ? undefined : eq(t.createdByUserId, user.id))
    .orderBy(desc(t.createdAt))
  return {
    tokens: rows.map(r => ({
      ...r, createdAt: r.createdAt.toISOString(), lastUsedAt: r.lastUsedAt?.toISOString() ?? null, revokedAt: r.revokedAt?.toISOString() ?? null,
    })),
  }
})

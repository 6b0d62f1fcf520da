import { auditQuerySchema } from '#shared/utils/profile-schema'

// The audit log, newest first, filtered; admins and safety officers read it.
export default defineApiHandler(async (event) => {
  await requireCapability(event, 'read-audit')
  const query = readQuery(event, auditQuerySchema)
  const { entityType, action, actor, q, from, to, page, pageSize } = query
  const t = schema.auditLog
  const conditions = [
    entityType ? eq(t.entityType, entityType) : undefined,
    action ? like(t.action, `${action.replace(/[%_\\]/g, '\\$&')}%`) : undefined,
    actor ? like(t.actorLabel, `%${actor.replace(/[%_\\]/g, '\\$&')}%`) : undefined,
    q ? or(like(t.entityId, `%${q.replace(/[%_\\]/g, '\\$&')}%`), sql`JSON_SEARCH(${t.details}, 'one', ${`%${q}%`}) IS NOT NULL`) : undefined,
    from ? gte(t.at, new Date(from)) : undefined,
    to ? lt(t.at, new Date(to)) : undefined,
  ].filter(c => c !== undefined)
  const where = conditions.length ? and(...conditions) : undefined
  const [rows, [total]] = await Promise.all([
    useDB().select().from(t).where(where).orderBy(desc(t.at), desc(t.id)).limit(pageSize).offset((page - 1) * pageSize),
    useDB().select({ n: sql<number>`COUNT(*)` }).from(t).where(where),
  ])
  return {
    entries: rows.map(r => ({ ...r, at: r.at.toISOString() })),
    page, pageSize, total: Number(total?.n ?? 0),
  }
})

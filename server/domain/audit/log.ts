import type { z } from 'zod'
import type { auditQuerySchema } from '../../../shared/utils/profile-schema'
import { and, desc, eq, gte, like, lt, or, schema, sql, useDB } from '../../utils/db'

const likeEscaped = (text: string) => text.replace(/[%_\\]/g, '\\$&')

/** The audit log, newest first, filtered and paged. */
export async function readAuditLog(query: z.infer<typeof auditQuerySchema>) {
  const { entityType, action, actor, q, from, to, page, pageSize } = query
  const t = schema.auditLog
  const conditions = [
    entityType ? eq(t.entityType, entityType) : undefined,
    action ? like(t.action, `${likeEscaped(action)}%`) : undefined,
    actor ? like(t.actorLabel, `%${likeEscaped(actor)}%`) : undefined,
    q ? or(like(t.entityId, `%${likeEscaped(q)}%`), sql`JSON_SEARCH(${t.details}, 'one', ${`%${q}%`}) IS NOT NULL`) : undefined,
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
}

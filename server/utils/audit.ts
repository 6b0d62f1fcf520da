import type { User } from '../db/schema'
import { schema } from './db'
import type { DB, Tx } from './db'

export type AuditActor = { user: Pick<User, 'id' | 'email'> } | { label: string, userId?: number | null }

/** Records one audit entry; pass the transaction so the entry lands with the change or not at all. */
export async function recordAudit(db: DB | Tx, actor: AuditActor, action: string, entityType: string,
  entityId: string | number, details?: Record<string, unknown>) {
  const actorUserId = 'user' in actor ? actor.user.id : (actor.userId ?? null)
  const actorLabel = 'user' in actor ? actor.user.email : actor.label
  await db.insert(schema.auditLog).values({
    actorUserId, actorLabel, action, entityType, entityId: String(entityId), details: details ?? null,
  })
}

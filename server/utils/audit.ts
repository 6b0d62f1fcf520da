import type { User } from '../db/schema'
import { schema } from './db'
import type { DB, Tx } from './db'

export const AUDIT_LENGTHS = { actorLabel: 160, action: 64, entityType: 32, entityId: 64 } as const
const clip = (text: string, max: number) => (text.length > max ? `${text.slice(0, max - 1)}…` : text)

export type AuditActor = { user: Pick<User, 'id' | 'email'> } | { label: string, userId?: number | null }

/** Records one audit entry; pass the transaction so the entry lands with the change or not at all. */
export async function recordAudit(db: DB | Tx, actor: AuditActor, action: string, entityType: string,
  entityId: string | number, details?: Record<string, unknown>) {
  const actorUserId = 'user' in actor ? actor.user.id : (actor.userId ?? null)
  const actorLabel = 'user' in actor ? actor.user.email : actor.label
  // Each text is held to its column's length (server/db/schema/audit.ts), so a long e-mail (up to 254) or token
  // name can never make the change it records fail.
  await db.insert(schema.auditLog).values({
    actorUserId, actorLabel: clip(actorLabel, AUDIT_LENGTHS.actorLabel), action: clip(action, AUDIT_LENGTHS.action),
    entityType: clip(entityType, AUDIT_LENGTHS.entityType), entityId: clip(String(entityId), AUDIT_LENGTHS.entityId), details: details ?? null,
  })
}

// How the outbox stands: what is waiting, how long the oldest due notice has waited, what is being sent and what
// failed. Read by /healthz, the alert log and the navigation badge of the safety office.
import { sql } from '../../utils/db'
import type { DB } from '../../utils/db'

export interface OutboxStatus {
  /** Notices not yet sent (waiting, retrying or being sent). */
  backlog: number
  /** Of those, due now and not held by a live claim. */
  due: number
  /** Held by a claim whose lease has not run out (being sent). */
  sending: number
  /** Waiting for a retry after a failed attempt. */
  retrying: number
  /** Seconds since the oldest due notice became due (0 when nothing is due). */
  oldestDueAgeS: number
  /** Deliveries given up after the retry period; `failedAlerts` counts the alert notices among them. */
  failed: number
  failedAlerts: number
}

export async function outboxStatus(db: DB): Promise<OutboxStatus> {
  const [rows] = await db.execute(sql`SELECT
      COUNT(*) AS backlog,
      COALESCE(SUM(next_attempt_at <= NOW(3)), 0) AS due,
      COALESCE(SUM(lease_until > NOW(3)), 0) AS sending,
      COALESCE(SUM(next_attempt_at > NOW(3) AND (lease_until IS NULL OR lease_until <= NOW(3)) AND attempts > 0), 0) AS retrying,
      COALESCE(TIMESTAMPDIFF(MICROSECOND, MIN(IF(next_attempt_at <= NOW(3), next_attempt_at, NULL)), NOW(3)), 0) AS oldestDueUs
    FROM outbox WHERE state = 'queued'`) as unknown as [Record<string, unknown>[]]
  const [failed] = await db.execute(sql`SELECT COUNT(*) AS failed, COALESCE(SUM(kind IN ('alert-raised', 'alert-cleared')), 0) AS failedAlerts
    FROM outbox WHERE state = 'failed'`) as unknown as [Record<string, unknown>[]]
  const r = rows[0] ?? {}
  const f = failed[0] ?? {}
  return {
    backlog: Number(r.backlog ?? 0), due: Number(r.due ?? 0), sending: Number(r.sending ?? 0), retrying: Number(r.retrying ?? 0),
    oldestDueAgeS: Math.round(Number(r.oldestDueUs ?? 0) / 1e3) / 1e3,
    failed: Number(f.failed ?? 0), failedAlerts: Number(f.failedAlerts ?? 0),
  }
}

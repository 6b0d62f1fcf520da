// Claiming outbox rows without holding anything while sending.
//
// A claim is one short READ COMMITTED transaction: per priority (alerts, all-clears, then invitations and resets) it
// reads the due rows in the order of the outbox_due index (state, priority, fan_seq, next_attempt_at) with
// FOR UPDATE SKIP LOCKED and a LIMIT, so the scan stops after the batch and locks only those rows (no gap locks at
// READ COMMITTED, so a filing that inserts notices never waits on it). Fresh notices come by their place in their
// fan-out (every airfield's first notices first), then the retry lane by next attempt. It then writes a fresh claim token, the
// claimer's name and a lease, moves next_attempt_at to the end of the lease and adds an attempt record, and commits.
// Only then does the worker send, outside any transaction. A row whose lease runs out (the claimer crashed) is due
// again; its open attempt is marked 'lease-expired' by the next claim.
//
// On a multi-primary cluster (Galera) row locks are local to a node: two nodes can both read the same rows, and the
// second to commit gets a certification conflict (error 1213) at COMMIT. The claim token is written and committed
// before anything is sent, so the loser has sent nothing: it drops the claim and moves on.
import { randomUUID } from 'node:crypto'
import { inArray, schema, sql, transaction } from '../../utils/db'
import type { DB } from '../../utils/db'
import { OUTBOX_RETRY_LANE, type OutboxRow } from '../../db/schema'

const PRIORITIES = [0, 1, 2]
const ms = (n: number) => sql.raw(String(Math.max(0, Math.round(n)) * 1000))

/** Whether a database error is a lost race (deadlock, lock wait, or a cluster certification conflict). */
export function isClaimConflict(err: unknown): boolean {
  for (let e = err as { errno?: number, cause?: unknown } | undefined, i = 0; e && i < 5; e = e.cause as typeof e, i++) {
    if (e.errno === 1213 || e.errno === 1205 || e.errno === 1180) return true
  }
  return false
}

export interface Claim { token: string, rows: OutboxRow[] }

export async function claimDue(db: DB, instanceId: string, opts: { batchSize: number, leaseMs: number }): Promise<Claim> {
  const token = randomUUID()
  const ids: number[] = []
  try {
    // attempts: 1: a lost race claims nothing this round (the next round claims again); `ids` is filled as it goes.
    await transaction(async (tx) => {
      for (const priority of PRIORITIES) {
        for (const lane of ['fresh', 'retry'] as const) {
          const want = opts.batchSize - ids.length
          if (want <= 0) break
          // Fresh notices: the only not-due rows this range holds are those under a live lease (in flight).
          const query = lane === 'fresh'
            ? sql`SELECT id FROM outbox FORCE INDEX (outbox_due)
                WHERE state = 'queued' AND priority = ${priority} AND fan_seq < ${OUTBOX_RETRY_LANE} AND next_attempt_at <= NOW(3)
                ORDER BY fan_seq, next_attempt_at, id LIMIT ${want} FOR UPDATE SKIP LOCKED`
            : sql`SELECT id FROM outbox FORCE INDEX (outbox_due)
                WHERE state = 'queued' AND priority = ${priority} AND fan_seq = ${OUTBOX_RETRY_LANE} AND next_attempt_at <= NOW(3)
                ORDER BY next_attempt_at, id LIMIT ${want} FOR UPDATE SKIP LOCKED`
          const [found] = await tx.execute(query) as unknown as [{ id: number }[]]
          ids.push(...found.map(r => Number(r.id)))
        }
      }
      if (!ids.length) return
      const idList = sql.join(ids.map(id => sql`${id}`), sql`, `)
      // An earlier claim of these rows ended without a result (its lease ran out): say so in its attempt record.
      await tx.execute(sql`UPDATE outbox_attempts SET outcome = 'lease-expired', finished_at = NOW(3)
        WHERE outbox_id IN (${idList}) AND outcome = 'sending'`)
      await tx.execute(sql`UPDATE outbox SET claim_token = ${token}, claimed_by = ${instanceId},
        lease_until = NOW(3) + INTERVAL ${ms(opts.leaseMs)} MICROSECOND, next_attempt_at = NOW(3) + INTERVAL ${ms(opts.leaseMs)} MICROSECOND,
        attempts = attempts + 1, first_attempt_at = COALESCE(first_attempt_at, NOW(3)), updated_at = NOW(3)
        WHERE id IN (${idList})`)
      await tx.execute(sql`INSERT INTO outbox_attempts (outbox_id, attempt, claim_token, instance)
        SELECT id, attempts, claim_token, claimed_by FROM outbox WHERE id IN (${idList})`)
    }, { db, attempts: 1, isolationLevel: 'read committed' })
  }
  catch (err) {
    if (isClaimConflict(err)) return { token, rows: [] }
    throw err
  }
  if (!ids.length) return { token, rows: [] }
  const o = schema.outbox
  const rows = await db.select().from(o).where(sql`${inArray(o.id, ids)} AND ${o.claimToken} = ${token}`)
  // Keep the claim order (priority, then due time).
  const order = new Map(ids.map((id, i) => [id, i]))
  rows.sort((a, b) => order.get(a.id)! - order.get(b.id)!)
  return { token, rows }
}

export type Outcome
  = | { row: OutboxRow, token: string, outcome: 'sent', instanceId: string }
    | { row: OutboxRow, token: string, outcome: 'error', error: string, retryInMs: number | null }
    | { row: OutboxRow, token: string, outcome: 'released' }

/**
 * Writes results back as they come: each message's own outcome, several in one short transaction when they come in
 * together (a few set-based statements per claim token for the sends and the give-backs, one pair per error).
 * Each update names the claim token: a result that comes back after the lease was lost still lands in its attempt
 * record, but does not overwrite the newer claimer's state.
 */
export async function recordOutcomes(db: DB, outcomes: Outcome[]) {
  if (!outcomes.length) return
  const groups = new Map<string, { outcome: 'sent' | 'released', token: string, instanceId: string, ids: number[] }>()
  const errors: Extract<Outcome, { outcome: 'error' }>[] = []
  for (const r of outcomes) {
    if (r.outcome === 'error') {
      errors.push(r)
      continue
    }
    const instanceId = r.outcome === 'sent' ? r.instanceId : ''
    const key = `${r.outcome} ${r.token} ${instanceId}`
    const g = groups.get(key) ?? { outcome: r.outcome, token: r.token, instanceId, ids: [] }
    g.ids.push(r.row.id)
    groups.set(key, g)
  }
  // Safe to repeat (every update is keyed by its claim token): transaction() retries a conflict.
  await transaction(async (tx) => {
    for (const g of groups.values()) {
      const idList = sql.join(g.ids.map(id => sql`${id}`), sql`, `)
      const where = sql`id IN (${idList}) AND claim_token = ${g.token}`
      if (g.outcome === 'sent') {
        // A sign-in link is not kept once it is on its way: only its hash stays, in user_tokens.
        await tx.execute(sql`UPDATE outbox SET state = 'sent', sent_at = NOW(3), sent_by = ${g.instanceId}, last_error = NULL,
          lease_until = NULL, updated_at = NOW(3),
          text_body = IF(kind IN ('invitation', 'password-reset'), '(link removed after sending)', text_body),
          html_body = IF(kind IN ('invitation', 'password-reset'), NULL, html_body) WHERE ${where}`)
        await tx.execute(sql`UPDATE outbox_attempts SET outcome = 'sent', finished_at = NOW(3), error = NULL
          WHERE outbox_id IN (${idList}) AND claim_token = ${g.token}`)
      }
      else {
        // Given back unsent by a stopping worker: due again now, and the claim does not count as an attempt.
        await tx.execute(sql`UPDATE outbox SET next_attempt_at = NOW(3), lease_until = NULL, attempts = GREATEST(0, attempts - 1),
          updated_at = NOW(3) WHERE ${where}`)
        await tx.execute(sql`UPDATE outbox_attempts SET outcome = 'released', finished_at = NOW(3)
          WHERE outbox_id IN (${idList}) AND claim_token = ${g.token}`)
      }
    }
    for (const r of errors) {
      const where = sql`id = ${r.row.id} AND claim_token = ${r.token}`
      const next = r.retryInMs == null
        ? sql`state = 'failed'`
        : sql`next_attempt_at = NOW(3) + INTERVAL ${ms(r.retryInMs)} MICROSECOND, fan_seq = ${OUTBOX_RETRY_LANE}`
      await tx.execute(sql`UPDATE outbox SET ${next}, last_error = ${r.error.slice(0, 1000)}, lease_until = NULL, updated_at = NOW(3) WHERE ${where}`)
      await tx.execute(sql`UPDATE outbox_attempts SET outcome = 'error', finished_at = NOW(3), error = ${r.error.slice(0, 1000)}
        WHERE outbox_id = ${r.row.id} AND claim_token = ${r.token}`)
    }
  }, { db, isolationLevel: 'read committed' })
}

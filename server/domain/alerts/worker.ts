// The outbox worker of one app instance: claims a bounded batch (claim.ts), sends it outside any transaction with a
// bound on concurrent sends per channel (e-mail over a pooled SMTP transport, pushes in parallel), writes each result
// back as it comes, and claims again while there is work. On stop (SIGTERM: Nitro's close hook) it claims nothing
// more, lets the sends in flight finish, gives the rest of its batch back and records all of it before it returns.
import { eq, schema } from '../../utils/db'
import type { DB } from '../../utils/db'
import type { OutboxRow } from '../../db/schema'
import { nextDelayMs, workerTiming, type WorkerTiming } from './backoff'
import { claimDue, recordOutcomes, type Outcome } from './claim'
import { writesSettled } from './give-way'
import { sendMail } from './mailer'
import { PushGoneError, PushRefusedError, sendPush } from './push'

export type Senders = {
  email: (row: OutboxRow) => Promise<void>
  push: (row: OutboxRow) => Promise<void>
}

export function defaultSenders(db: DB): Senders {
  return {
    email: async (row) => {
      await sendMail({ to: row.toAddress!, subject: row.subject ?? '(no subject)', text: row.textBody ?? '', html: row.htmlBody,
        deliveryId: row.deliveryId, headers: { 'X-Veerline-Delivery': row.deliveryId, 'X-Veerline-Kind': row.kind } })
    },
    push: async (row) => {
      const [device] = await db.select().from(schema.pushSubscriptions).where(eq(schema.pushSubscriptions.id, row.pushSubscriptionId ?? 0))
      if (!device) throw new PushGoneError('the push subscription was removed')
      try {
        await sendPush(db, device, { ...row.pushPayload, deliveryId: row.deliveryId }, row.deliveryId)
      }
      catch (err) {
        if (err instanceof PushGoneError) await db.delete(schema.pushSubscriptions).where(eq(schema.pushSubscriptions.id, device.id))
        throw err
      }
    },
  }
}

export interface WorkerOptions {
  instanceId: string
  batchSize: number
  concurrency: { email: number, push: number }
  intervalMs: number
  /** Longest a new send waits for this instance's write requests to be answered (give-way.ts). */
  giveWayMs: number
  timing: WorkerTiming
}

export function workerOptions(instanceId: string, env: NodeJS.ProcessEnv = process.env): WorkerOptions {
  const int = (name: string, fallback: number) => {
    const v = Number(env[name])
    return Number.isInteger(v) && v > 0 ? v : fallback
  }
  return {
    instanceId,
    batchSize: int('VEERLINE_OUTBOX_BATCH', 50),
    concurrency: { email: int('VEERLINE_OUTBOX_EMAIL_CONCURRENCY', 8), push: int('VEERLINE_OUTBOX_PUSH_CONCURRENCY', 16) },
    intervalMs: int('VEERLINE_OUTBOX_INTERVAL_MS', 250),
    giveWayMs: int('VEERLINE_OUTBOX_GIVE_WAY_MS', 200),
    timing: workerTiming(env),
  }
}

/** A bound on concurrent sends: `acquire` resolves once one of `limit` slots is free. */
class Slots {
  private waiters: (() => void)[] = []
  constructor(private free: number) {}
  async acquire() {
    if (this.free > 0) {
      this.free--
      return
    }
    await new Promise<void>(r => this.waiters.push(r))
  }

  release() {
    const next = this.waiters.shift()
    if (next) next()
    else this.free++
  }
}

export class OutboxWorker {
  private stopping = false
  private loop: Promise<void> | null = null
  private timer: ReturnType<typeof setTimeout> | null = null
  private pending: Outcome[] = []
  private flushing: Promise<void> | null = null
  private woken = false
  lastError: string | null = null

  constructor(private db: DB, private senders: Senders, readonly opts: WorkerOptions) {}

  start() {
    this.schedule(0)
  }

  private schedule(delayMs: number) {
    if (this.stopping) return
    this.timer = setTimeout(() => {
      this.timer = null
      this.woken = false
      this.loop = this.run().finally(() => {
        this.loop = null
        // Woken while claiming: what was queued meanwhile may have missed that claim, so look again at once.
        this.schedule(this.woken ? 0 : this.opts.intervalMs)
      })
    }, delayMs)
    this.timer.unref?.()
  }

  /**
   * Claims now rather than at the next poll: called once a write that queued notices on this instance has been
   * answered (its transaction committed), so an alert goes out without waiting for the poll.
   */
  wake() {
    if (this.stopping) return
    this.woken = true
    if (this.timer && !this.loop) {
      clearTimeout(this.timer)
      this.timer = null
      this.schedule(0)
    }
  }

  /**
   * Claims and sends batch after batch while full batches come back (bounded per call), then rests. Each channel
   * starts the rows of a claim as its slots free up, and the next claim is made as soon as every row of this one has
   * started: the send lanes stay busy over the tail of a batch instead of waiting for its slowest send. At most
   * one batch waits for a slot (besides the sends in flight), so a later alert of another airfield is at most one
   * batch behind.
   */
  private async run() {
    const slots = { email: new Slots(this.opts.concurrency.email), push: new Slots(this.opts.concurrency.push) }
    const inFlight = new Set<Promise<void>>()
    try {
      for (let round = 0; round < 1000 && !this.stopping; round++) {
        // Neither claims nor sends while this instance answers a write request (give-way.ts).
        await writesSettled(this.opts.giveWayMs)
        const { token, rows } = await claimDue(this.db, this.opts.instanceId, { batchSize: this.opts.batchSize, leaseMs: this.opts.timing.leaseMs })
        if (!rows.length) break
        await Promise.all((['email', 'push'] as const).map(async (ch) => {
          for (const row of rows.filter(r => r.channel === ch)) {
            // A filing (or another write) being answered by this instance goes first (give-way.ts).
            await writesSettled(this.opts.giveWayMs)
            await slots[ch].acquire()
            if (this.stopping) {
              // Stopping: what has not started goes back to the queue, unsent and recorded as given back.
              slots[ch].release()
              this.record([{ row, token, outcome: 'released' }])
              continue
            }
            const send: Promise<void> = this.sendOne(row, token).finally(() => {
              slots[ch].release()
              inFlight.delete(send)
            })
            inFlight.add(send)
          }
        }))
        if (rows.length < this.opts.batchSize) break
      }
    }
    catch (err) {
      this.lastError = (err as Error).message
      console.error('[veerline] outbox worker:', this.lastError)
    }
    finally {
      await Promise.all(inFlight)
      await this.flush()
    }
  }

  private async sendOne(row: OutboxRow, token: string) {
    try {
      await (row.channel === 'email' ? this.senders.email(row) : this.senders.push(row))
      this.record([{ row, token, outcome: 'sent', instanceId: this.opts.instanceId }])
    }
    catch (err) {
      const error = err instanceof Error ? err.message : String(err)
      const sinceFirst = Date.now() - (row.firstAttemptAt ?? new Date()).getTime()
      const retryInMs = err instanceof PushGoneError || err instanceof PushRefusedError ? null : nextDelayMs(row.attempts, sinceFirst, this.opts.timing)
      this.record([{ row, token, outcome: 'error', error, retryInMs }])
    }
  }

  /** Queues results and writes them at once, or with the next write when one is already going. */
  private record(outcomes: Outcome[]) {
    this.pending.push(...outcomes)
    if (!this.flushing) this.flushing = this.drain()
  }

  private async drain() {
    try {
      while (this.pending.length) {
        // Results wait (briefly, the lease covers it) while this instance answers a write request; then all at once.
        await writesSettled(this.opts.giveWayMs)
        const batch = this.pending.splice(0, 100)
        for (let tries = 0; ; tries++) {
          try {
            await recordOutcomes(this.db, batch)
            break
          }
          catch (err) {
            // The database went away for a moment: keep the results and try again (bounded); the lease covers it.
            if (tries >= 20) {
              console.error('[veerline] outbox results not recorded:', (err as Error).message)
              break
            }
            await new Promise(r => setTimeout(r, 250))
          }
        }
      }
    }
    finally {
      this.flushing = null
    }
  }

  async flush() {
    while (this.flushing) await this.flushing
  }

  /** Stops claiming, waits for the sends in flight, gives back what was not started and records everything. */
  async stop() {
    this.stopping = true
    if (this.timer) clearTimeout(this.timer)
    this.timer = null
    if (this.loop) await this.loop
    await this.flush()
  }
}

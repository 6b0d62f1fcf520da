import { describe, expect, it } from 'vitest'
import { nextDelayMs, retryPolicy, workerTiming } from '../../../server/domain/alerts/backoff'

/** Simulates a mail server that refuses everything until `outageMs`: when is the message delivered (or failed)? */
function simulate(outageMs: number, policy = retryPolicy({})) {
  let t = 0
  for (let attempts = 1; attempts < 100_000; attempts++) {
    if (t >= outageMs) return { deliveredAtMs: t, attempts }
    const delay = nextDelayMs(attempts, t, policy)
    if (delay == null) return { failedAtMs: t, attempts }
    t += delay
  }
  throw new Error('no end')
}

describe('outbox retry policy', () => {
  // Exponential backoff with a cap, base·2^(n−1) (common practice for retrying a remote service).
  it('doubles from 1 s, is capped at 5 minutes, and retries for 24 hours by default', () => {
    const p = retryPolicy({})
    expect(p).toEqual({ baseMs: 1000, maxMs: 300_000, retryForMs: 24 * 3600_000 })
    expect([1, 2, 3, 4, 5, 6, 7, 8, 9, 10].map(n => nextDelayMs(n, 0, p)))
      .toEqual([1000, 2000, 4000, 8000, 16000, 32000, 64000, 128000, 256000, 300000])
    expect(nextDelayMs(500, 0, p)).toBe(300_000)
  })

  it('gives up only when the next try would fall after the retry period', () => {
    const p = retryPolicy({ VEERLINE_OUTBOX_RETRY_HOURS: '1' })
    expect(nextDelayMs(20, 3600_000 - 300_001, p)).toBe(300_000)
    expect(nextDelayMs(20, 3600_000 - 299_999, p)).toBeNull()
    const never = simulate(Number.POSITIVE_INFINITY, p)
    expect(never.failedAtMs).toBeGreaterThan(3600_000 - 300_000)
    expect(never.failedAtMs).toBeLessThanOrEqual(3600_000)
  })

  it('a 10-minute outage ends with the message delivered, at most one capped delay after the mail server is back', () => {
    const r = simulate(10 * 60_000)
    expect(r.failedAtMs).toBeUndefined()
    expect(r.deliveredAtMs).toBeGreaterThanOrEqual(600_000)
    expect(r.deliveredAtMs! - 600_000).toBeLessThanOrEqual(300_000)
    // Under the old policy (15 attempts, 1 s doubling, capped at 60 s) the same outage failed the message after
    // about 9 minutes: 1+2+…+32 s + 8·60 s = 543 s after the first attempt came the 15th and last.
    let t = 0
    for (let n = 1; n < 15; n++) t += Math.min(60_000, 1000 * 2 ** (n - 1))
    expect(t).toBe(543_000)
  })

  it('the time scale shortens every duration alike (the outage test runs at 1/100)', () => {
    const env = { VEERLINE_OUTBOX_TIME_SCALE: '0.01' }
    expect(retryPolicy(env)).toEqual({ baseMs: 10, maxMs: 3000, retryForMs: 864_000 })
    expect(workerTiming(env).leaseMs).toBe(1200)
    const r = simulate(6000, retryPolicy(env))
    expect(r.deliveredAtMs! - 6000).toBeLessThanOrEqual(3000)
  })
})

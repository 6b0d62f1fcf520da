// Retry timing of the outbox worker: exponential backoff with a cap, for a retry period (default 24 h) after the
// first attempt; then the delivery is failed. VEERLINE_OUTBOX_TIME_SCALE shortens every duration at once (the
// outage test runs a 10-minute outage at 1/100 speed); it is 1 in normal use.
export interface RetryPolicy { baseMs: number, maxMs: number, retryForMs: number }
export interface WorkerTiming extends RetryPolicy { leaseMs: number }

const num = (env: NodeJS.ProcessEnv, name: string, fallback: number) => {
  const v = Number(env[name])
  return env[name] !== undefined && env[name] !== '' && Number.isFinite(v) && v > 0 ? v : fallback
}

export function timeScale(env: NodeJS.ProcessEnv = process.env) {
  return num(env, 'VEERLINE_OUTBOX_TIME_SCALE', 1)
}

export function retryPolicy(env: NodeJS.ProcessEnv = process.env): RetryPolicy {
  const k = timeScale(env)
  return {
    baseMs: num(env, 'VEERLINE_OUTBOX_BACKOFF_MS', 1000) * k,
    maxMs: num(env, 'VEERLINE_OUTBOX_BACKOFF_MAX_MS', 300_000) * k,
    retryForMs: num(env, 'VEERLINE_OUTBOX_RETRY_HOURS', 24) * 3600_000 * k,
  }
}

export function workerTiming(env: NodeJS.ProcessEnv = process.env): WorkerTiming {
  const k = timeScale(env)
  return {
    ...retryPolicy(env),
    // How long a claim holds a row before another worker may take it (a crashed worker's rows come back then).
    leaseMs: num(env, 'VEERLINE_OUTBOX_LEASE_MS', 120_000) * k,
  }
}

/**
 * After `attempts` tries (1 = the first failed), `sinceFirstMs` after the first: wait base·2^(attempts−1), at most
 * maxMs; null = give up, because the next try would fall after the retry period.
 */
export function nextDelayMs(attempts: number, sinceFirstMs: number, policy: RetryPolicy): number | null {
  const delay = Math.min(policy.maxMs, policy.baseMs * 2 ** Math.min(60, Math.max(0, attempts - 1)))
  if (sinceFirstMs + delay > policy.retryForMs) return null
  return delay
}

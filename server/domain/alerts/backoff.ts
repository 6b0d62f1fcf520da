// Retry timing of the outbox worker: exponential backoff with a cap, and when to give up.
export interface RetryPolicy { baseMs: number, maxMs: number, maxAttempts: number }

export function retryPolicy(env: NodeJS.ProcessEnv = process.env): RetryPolicy {
  const n = (name: string, fallback: number) => {
    const v = Number(env[name])
    return Number.isFinite(v) && v > 0 ? v : fallback
  }
  return {
    baseMs: n('VEERLINE_OUTBOX_BACKOFF_MS', 1000),
    maxMs: n('VEERLINE_OUTBOX_BACKOFF_MAX_MS', 60_000),
    maxAttempts: n('VEERLINE_OUTBOX_MAX_ATTEMPTS', 15),
  }
}

/** After `attempts` failed tries (1 = the first failed): wait base·2^(attempts-1), at most maxMs; null = give up. */
export function nextDelayMs(attempts: number, policy: RetryPolicy): number | null {
  if (attempts >= policy.maxAttempts) return null
  return Math.min(policy.maxMs, policy.baseMs * 2 ** Math.max(0, attempts - 1))
}

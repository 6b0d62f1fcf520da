// Sending gives way to this instance's own write requests (a filing, a limit change). The worker and the routes share
// one event loop: during a fan-out, hundreds of send callbacks would queue ahead of a filing's database answers. While
// a write request is being answered, the worker starts no new send (sends in flight go on), for at most `maxHoldMs` at
// a time, so a steady stream of writes slows delivery but never stops it.
let active = 0
let waiters: (() => void)[] = []

/** Marks a write request as begun; call the returned function once it is answered (more calls do nothing). */
export function writeBegun(): () => void {
  active++
  let ended = false
  return () => {
    if (ended) return
    ended = true
    active--
    if (active === 0) {
      const ready = waiters
      waiters = []
      for (const w of ready) w()
    }
  }
}

/** Resolves once no write request is being answered, or after `maxHoldMs`. */
export async function writesSettled(maxHoldMs: number): Promise<void> {
  if (active === 0) return
  await new Promise<void>((resolve) => {
    const done = () => {
      clearTimeout(timer)
      waiters = waiters.filter(w => w !== done)
      resolve()
    }
    const timer = setTimeout(done, maxHoldMs)
    waiters.push(done)
  })
}

export const writesInProgress = () => active

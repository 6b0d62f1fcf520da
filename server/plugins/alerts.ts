// The outbox worker, which polls for due deliveries on an interval in every instance. (The evaluation itself is
// called directly by filing, withdrawal and limit changes: server/domain/alerts/evaluate.ts.)
import { randomBytes } from 'node:crypto'
import { defaultSenders, runOutboxOnce } from '../domain/alerts/worker'
import { vapidKeys } from '../domain/alerts/push'

export default defineNitroPlugin((nitroApp) => {
  if (process.env.VEERLINE_OUTBOX_WORKER === '0' || import.meta.prerender) return
  const instanceId = `${process.pid}-${randomBytes(3).toString('hex')}`
  const intervalMs = Number(process.env.VEERLINE_OUTBOX_INTERVAL_MS) || 500
  const db = useDB()
  const senders = defaultSenders(db)
  let running = false
  let stopped = false
  // Make the VAPID keys on first start, not on the first push.
  vapidKeys(db).catch(err => console.error('[veerline] VAPID keys not ready yet:', err?.message))

  const tick = async () => {
    if (running || stopped) return
    running = true
    try {
      for (let round = 0; round < 20 && !stopped; round++) {
        if (await runOutboxOnce(db, senders, instanceId) === 0) break
      }
    }
    catch (err) {
      console.error('[veerline] outbox worker:', (err as Error).message)
    }
    finally {
      running = false
    }
  }
  const timer = setInterval(tick, intervalMs)
  timer.unref?.()
  nitroApp.hooks.hook('close', () => {
    stopped = true
    clearInterval(timer)
  })
})

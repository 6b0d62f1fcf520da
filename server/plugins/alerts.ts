// Alerts inside the app: evaluation on every profile or limit change (in the same transaction) and the outbox
// worker, which polls for due deliveries on an interval.
import { randomBytes } from 'node:crypto'
import { evaluateAirfield } from '../domain/alerts/evaluate'
import { defaultSenders, runOutboxOnce } from '../domain/alerts/worker'
import { vapidKeys } from '../domain/alerts/push'

export default defineNitroPlugin((nitroApp) => {
  const appUrl = () => process.env.NUXT_PUBLIC_APP_URL || useRuntimeConfig().public.appUrl

  onProfileChange(async (change, tx) => {
    await evaluateAirfield(tx, change.airfieldId, appUrl())
  })

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

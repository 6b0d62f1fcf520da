// The demo stays alive: outside production, each start and each new UTC day while running files that day's demo
// profiles through the filing path (server/seed/demo-day.ts; idempotent, so a restart or a second instance doubles
// nothing). VEERLINE_DEMO_DATE=YYYY-MM-DD fixes the day (tests and demos).
import { demoDay, demoDaysEnabled, fileDemoDay } from '../seed/demo-day'

export default defineNitroPlugin((nitroApp) => {
  if (!demoDaysEnabled() || import.meta.prerender) return
  const db = useDB()
  let lastDay = ''
  let running = false
  const run = async () => {
    if (running) return
    const day = demoDay()
    if (!day) {
      if (lastDay !== 'bad') console.error('[veerline] demo day: VEERLINE_DEMO_DATE must be a date written YYYY-MM-DD')
      lastDay = 'bad'
      return
    }
    const key = day.toISOString().slice(0, 10)
    if (key === lastDay) return
    running = true
    try {
      const r = await fileDemoDay(db, day)
      lastDay = key
      console.log(`[veerline] demo day ${r.day}: filed ${r.filed}, already there ${r.present}, refused ${r.refused.length}`
        + (r.refused.length ? ` (${r.refused.map(x => `${x.airfield} ${x.hourZ}Z: ${x.message}`).join('; ')})` : ''))
    }
    catch (err) {
      console.error('[veerline] demo day:', (err as Error).message)
    }
    finally {
      running = false
    }
  }
  setTimeout(run, 0)
  // A new UTC day while running: checked every minute, filed once.
  const timer = setInterval(run, 60_000)
  timer.unref?.()
  nitroApp.hooks.hook('close', () => clearInterval(timer))
})

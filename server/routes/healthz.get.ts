import { outboxStatus } from '../domain/alerts/outbox-status'
import { sharedRead } from '../utils/shared-read'

const startedAt = Date.now()

// Open to all (load balancers and people alike): says whether the app and its database answer.
export default defineEventHandler(async (event) => {
  const app = { name: 'veerline', state: 'up', uptimeS: Math.round((Date.now() - startedAt) / 1000) }
  try {
    const started = performance.now()
    await Promise.race([
      usePool().query('SELECT 1'),
      new Promise((_, reject) => setTimeout(() => reject(new Error('no answer within 2 s')), 2000)),
    ])
    const latencyMs = Math.round(performance.now() - started)
    // The delivery queue: notices waiting and how long the oldest due one has waited (seconds).
    // Checks arriving together share one read of it (made after each arrived): a load balancer's polling stays cheap.
    const o = await sharedRead('healthz-outbox', () => outboxStatus(useDB()))
    const outbox = { backlog: o.backlog, due: o.due, sending: o.sending, retrying: o.retrying, oldestDueAgeS: o.oldestDueAgeS, failed: o.failed }
    return { status: 'ok', app, database: { state: 'up', latencyMs }, outbox }
  }
  catch (err) {
    setResponseStatus(event, 503)
    return {
      status: 'unavailable',
      app,
      database: { state: 'down', message: `The database does not answer: ${(err as Error).message}` },
    }
  }
})

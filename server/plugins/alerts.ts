// The outbox worker of this instance (server/domain/alerts/worker.ts), which claims due deliveries with a lease. (The
// evaluation itself is called directly by filing, withdrawal and limit changes: server/domain/alerts/evaluate.ts.)
// On SIGTERM Nitro calls the close hook, which stops the worker gracefully: no new claims, sends in flight finish, the
// rest of the batch is given back, all recorded.
import { hostname } from 'node:os'
import { randomBytes } from 'node:crypto'
import { defaultSenders, OutboxWorker, workerOptions } from '../domain/alerts/worker'
import { vapidKeys } from '../domain/alerts/push'
import { closeMail } from '../domain/alerts/mailer'
import { writeBegun } from '../domain/alerts/give-way'
import { queuedMark } from '../domain/alerts/queued'

export default defineNitroPlugin((nitroApp) => {
  if (process.env.VEERLINE_OUTBOX_WORKER === '0' || import.meta.prerender) return
  // Written into every claim and attempt record: which instance sent what.
  const instanceId = (process.env.VEERLINE_INSTANCE_ID || `${hostname()}-${process.pid}-${randomBytes(3).toString('hex')}`).slice(0, 64)
  const db = useDB()
  // Make the VAPID keys on first start, not on the first push.
  vapidKeys(db).catch(err => console.error('[veerline] VAPID keys not ready yet:', err?.message))
  const worker = new OutboxWorker(db, defaultSenders(db), workerOptions(instanceId))
  // Write requests to the API go ahead of new sends (give-way.ts): counted from the request until its response closes.
  // A write that queued notices wakes the worker once it is answered, its transaction committed (queued.ts).
  nitroApp.hooks.hook('request', (event) => {
    const method = event.method
    if (method === 'GET' || method === 'HEAD' || method === 'OPTIONS' || !event.path.startsWith('/api/')) return
    const ended = writeBegun()
    const mark = queuedMark()
    event.node.res.once('close', () => {
      ended()
      if (queuedMark() !== mark) worker.wake()
    })
  })
  worker.start()
  console.log(`[veerline] outbox worker ${instanceId} started`)
  nitroApp.hooks.hook('close', async () => {
    await worker.stop()
    closeMail()
    console.log(`[veerline] outbox worker ${instanceId} stopped; every result recorded`)
  })
})

// While the database is out of reach, every answer (API, page, any other route) is 503 with Retry-After and plain
// words, never 500. defineApiHandler maps what API routes throw; this hook sees errors from anything else (pages,
// nuxt-auth-utils' session route, middleware) before the error handler renders them, and gives every 503 its
// Retry-After.
import { setResponseHeader } from 'h3'

type MutableError = Error & { statusCode?: number, statusMessage?: string, unhandled?: boolean, fatal?: boolean }

function rootCause(err: unknown): string {
  let e = err as { cause?: unknown, message?: string, code?: string } | undefined
  for (let i = 0; e?.cause && i < 8; i++) e = e.cause as typeof e
  return `${e?.code ? `${e.code}: ` : ''}${e?.message ?? String(err)}`.slice(0, 300)
}

export default defineNitroPlugin((nitroApp) => {
  let lastLoggedAt = 0
  nitroApp.hooks.hook('error', (error, { event }) => {
    const e = error as MutableError
    if (!event || !(isDatabaseUnavailable(e) || e.statusCode === 503)) return
    // One line a second at most, so that an outage does not flood the log.
    if (Date.now() - lastLoggedAt > 1000) {
      lastLoggedAt = Date.now()
      console.warn(`[veerline] 503 ${event.method} ${event.path.split('?')[0]}: ${rootCause(e)}`)
    }
    if (e.statusCode !== 503 || e.unhandled) {
      e.statusCode = 503
      e.statusMessage = databaseUnavailableMessage()
      e.message = e.statusMessage
      e.unhandled = false
      e.fatal = false
    }
    if (!event.node.res.headersSent) setResponseHeader(event, 'retry-after', DB_RETRY_AFTER_S)
  })
})

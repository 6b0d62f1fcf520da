import type { EventHandlerRequest, H3Event } from 'h3'
import { ZodError } from 'zod'
import { DOMAIN_ERROR_STATUS, DomainError, invalidMessage, issuesOf } from './errors'

/** Error codes (mysql2 / Node) that mean the database cannot be reached right now, not that the request was wrong. */
const UNREACHABLE_CODES = new Set([
  'ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENOTFOUND', 'EPIPE', 'EAI_AGAIN',
  'PROTOCOL_CONNECTION_LOST', 'PROTOCOL_SEQUENCE_TIMEOUT', 'ER_CON_COUNT_ERROR', 'ER_SERVER_SHUTDOWN',
  'ER_ACCESS_DENIED_ERROR', 'ER_BAD_DB_ERROR',
])
/** How long a client should wait before trying again while the database is away. */
export const DB_RETRY_AFTER_S = 5

/** True when `err` (or any error in its `cause` chain, as drizzle wraps driver errors) says the database is away. */
export function isDatabaseUnreachable(err: unknown): boolean {
  let e: unknown = err
  for (let depth = 0; e && depth < 6; depth++) {
    const code = (e as { code?: unknown }).code
    if (typeof code === 'string' && UNREACHABLE_CODES.has(code)) return true
    const message = (e as { message?: unknown }).message
    if (typeof message === 'string' && /Pool is closed|connect ETIMEDOUT|Connection lost|closed state/i.test(message)) return true
    e = (e as { cause?: unknown }).cause
  }
  return false
}

/** Maps what a handler threw to the one error contract; HTTP errors made with createError pass unchanged. */
export function toHttpError(event: H3Event, err: unknown): unknown {
  if (err instanceof DomainError) {
    return createError({
      statusCode: DOMAIN_ERROR_STATUS[err.kind],
      statusMessage: err.message,
      data: err.kind === 'invalid' ? { issues: err.issues } : undefined,
    })
  }
  if (err instanceof ZodError) {
    const issues = issuesOf(err)
    return createError({ statusCode: 422, statusMessage: invalidMessage(issues), data: { issues } })
  }
  if (isDatabaseUnreachable(err)) {
    setResponseHeader(event, 'Retry-After', DB_RETRY_AFTER_S)
    return createError({
      statusCode: 503,
      statusMessage: `The database is not answering just now; try again in ${DB_RETRY_AFTER_S} seconds`,
    })
  }
  return err
}

/**
 * Every API route is `export default defineApiHandler(async (event) => ...)`: the handler asks who is asking,
 * reads params, query and body, calls the domain and answers; whatever it throws is mapped here.
 */
export function defineApiHandler<T, R extends EventHandlerRequest = EventHandlerRequest>(
  handler: (event: H3Event<R>) => T | Promise<T>,
) {
  // Both type arguments: with the request type alone, h3 would type every answer as `any` for the pages.
  return defineEventHandler<R, Promise<Awaited<T>>>(async (event): Promise<Awaited<T>> => {
    try {
      return (await handler(event)) as Awaited<T>
    }
    catch (err) {
      throw toHttpError(event, err)
    }
  })
}

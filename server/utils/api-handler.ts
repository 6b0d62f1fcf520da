import type { EventHandlerRequest, H3Event } from 'h3'
import { ZodError } from 'zod'
import { DOMAIN_ERROR_STATUS, DomainError, invalid, invalidMessage, issuesOf } from './errors'
import { DB_RETRY_AFTER_S, databaseUnavailableMessage, isDatabaseUnavailable } from './db'

/** Maps what a handler threw to the one error contract; HTTP errors made with createError pass unchanged. */
export function toHttpError(event: H3Event, err: unknown): unknown {
  if (err instanceof DomainError) {
    return createError({
      statusCode: DOMAIN_ERROR_STATUS[err.kind],
      statusMessage: err.message,
      data: err.kind === 'invalid' || err.issues.length ? { issues: err.issues } : undefined,
    })
  }
  if (err instanceof ZodError) {
    const issues = issuesOf(err)
    return createError({ statusCode: 422, statusMessage: invalidMessage(issues), data: { issues } })
  }
  // Out of reach, or too busy with conflicting changes after transaction()'s retries (server/utils/db.ts).
  if (isDatabaseUnavailable(err)) {
    setResponseHeader(event, 'Retry-After', DB_RETRY_AFTER_S)
    return createError({ statusCode: 503, statusMessage: databaseUnavailableMessage() })
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

type Schema<T> = { safeParse: (input: unknown) => { success: true, data: T } | { success: false, error: ZodError } }

/** Parses `input` with `schema`, or throws the contract's 422; `root` names the whole input when a path is empty. */
export function parseWith<T>(schema: Schema<T>, input: unknown, root: string, summary: string): T {
  const parsed = schema.safeParse(input)
  if (parsed.success) return parsed.data
  const issues = issuesOf(parsed.error, root)
  throw invalid(issues, invalidMessage(issues, summary))
}

// The same address asked again gives the same parameters and query: their checked values are kept per schema and
// raw text (bounded in number and length; refusals are not kept), so a busy route does not parse the same text
// thousands of times a second. Schemas of paths and queries are pure: the same text always checks the same way.
// A shallow copy is handed out each time.
const CHECKED_MAX = 500
const CHECKED_RAW_MAX = 256
const checked = new WeakMap<object, Map<string, unknown>>()

function parseKept<T>(schema: Schema<T>, raw: string, input: () => unknown, root: string, summary: string): T {
  let kept = checked.get(schema)
  if (!kept) checked.set(schema, kept = new Map())
  const hit = kept.get(raw) as T | undefined
  const value = hit ?? parseWith(schema, input(), root, summary)
  if (hit === undefined && raw.length <= CHECKED_RAW_MAX) {
    if (kept.size >= CHECKED_MAX) kept.delete(kept.keys().next().value!)
    kept.set(raw, value)
  }
  return value && typeof value === 'object' ? { ...value } : value
}

/** The route's path parameters, checked; a bad one is 422 naming the parameter (never a 400 with a raw dump). */
export function readParams<T>(event: H3Event, schema: Schema<T>): T {
  const params = event.context.params ?? {}
  return parseKept(schema, JSON.stringify(params), () => getRouterParams(event, { decode: true }), '(path)', 'The address is not valid')
}

/** The query string, checked; a bad value is 422 naming the query parameter. */
export function readQuery<T>(event: H3Event, schema: Schema<T>): T {
  const q = event.path.indexOf('?')
  return parseKept(schema, q < 0 ? '' : event.path.slice(q + 1), () => getQuery(event), '(query)', 'The query is not valid')
}

/** The JSON body, checked; a body that is not JSON, or fails the schema, is 422. */
export async function readBodyWith<T>(event: H3Event, schema: Schema<T>, summary = 'Some fields need attention'): Promise<T> {
  let body: unknown
  try {
    body = await readBody(event)
  }
  catch (err) {
    // The request guard's refusals (400 cut short, 413 too large, 415 wrong type, 422 too deep) pass as they are;
    // only h3's own "Invalid JSON body" becomes the contract's 422.
    if (isError(err) && !(err.statusCode === 400 && /invalid json/i.test(err.message))) throw err
    throw invalid([{ field: '(body)', message: 'The body is not valid JSON' }], 'The body is not valid JSON')
  }
  return parseWith(schema, body, '(body)', summary)
}

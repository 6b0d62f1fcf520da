// The API's error contract as the client sees it: a plain message and, for refused input, the issues by field
// (422 `{ statusMessage, data: { issues: [{ field, message, line?, index? }] } }`, paths like `levels[1].directionDeg`).

export type ApiIssue = { field: string, message: string, line?: number, index?: number }

/** What a failed API call turns into: `message` a person can act on, `issues` beside the form's fields. */
export class ApiError extends Error {
  override readonly name = 'ApiError'
  constructor(
    /** HTTP status; 0 when the server did not answer at all. */
    readonly status: number,
    message: string,
    readonly issues: ApiIssue[] = [],
    /** Seconds from a `Retry-After` header (429, 503), when the server sent one. */
    readonly retryAfterS: number | null = null,
  ) {
    super(message)
  }

  // Read by Nuxt's createError when useFetch keeps the error: status, message and issues survive the copy.
  get statusCode() {
    return this.status
  }

  get statusMessage() {
    return this.message
  }

  get data() {
    return { issues: this.issues }
  }
}

/** Words for a status that came without a message of its own (or with h3's bare defaults). */
const STATUS_WORDS: Record<number, string> = {
  0: 'The server did not answer: check the connection and try again',
  400: 'The request was not understood',
  401: 'You are signed out: sign in again',
  403: 'Your role may not do this',
  404: 'Not found',
  405: 'This action is not offered here',
  409: 'This conflicts with what is already saved',
  410: 'This link is used up or has expired',
  413: 'What you sent is too large',
  422: 'Some of what you entered is not valid',
  429: 'Too many attempts: wait a little and try again',
  503: 'The service is not available just now: try again in a moment',
}
const BARE_DEFAULTS = new Set(['', 'Server Error', 'Internal Server Error', 'Bad Request', 'Unauthorized', 'Forbidden', 'Not Found', 'Unprocessable Entity'])

export function statusWords(status: number): string {
  return STATUS_WORDS[status] ?? (status >= 500 ? 'The server could not do this just now: try again' : `The request was refused (${status})`)
}

function isIssue(v: unknown): v is ApiIssue {
  return typeof v === 'object' && v !== null && typeof (v as ApiIssue).field === 'string' && typeof (v as ApiIssue).message === 'string'
}

function issuesIn(data: unknown): ApiIssue[] {
  const list = (data as { issues?: unknown } | null | undefined)?.issues
  return Array.isArray(list) ? list.filter(isIssue) : []
}

/**
 * The contract's error from an HTTP answer: `body` is the parsed JSON (h3 sends `{ statusCode, statusMessage,
 * message, data }`), `retryAfter` the header's text if any.
 */
export function apiErrorFromResponse(status: number, body: unknown, retryAfter?: string | null): ApiError {
  const b = (typeof body === 'object' && body !== null ? body : {}) as { statusMessage?: unknown, message?: unknown, data?: unknown }
  const given = [b.statusMessage, b.message].find((m): m is string => typeof m === 'string' && !BARE_DEFAULTS.has(m.trim()))
  const seconds = retryAfter != null && /^\d+$/.test(retryAfter.trim()) ? Number(retryAfter.trim()) : null
  return new ApiError(status, given?.trim() || statusWords(status), issuesIn(b.data), seconds)
}

/**
 * `{ message, status, issues }` from anything a failed call may throw: an ApiError from `$api`, the error `useApi`
 * keeps (Nuxt copies status, message and data), or a plain fetch error. `fallback` is for errors with no words.
 */
export function fetchFailure(err: unknown, fallback: string): { message: string, status: number, issues: ApiIssue[] } {
  if (err instanceof ApiError) return { message: err.message, status: err.status, issues: err.issues }
  const e = (typeof err === 'object' && err !== null ? err : {}) as { statusCode?: unknown, status?: unknown, statusMessage?: unknown, message?: unknown, data?: unknown }
  const status = typeof e.statusCode === 'number' ? e.statusCode : typeof e.status === 'number' ? e.status : 0
  // A raw fetch error carries the server's body in `data`; a kept one carries the contract's `{ issues }` there.
  const body = e.data as { statusMessage?: unknown, data?: unknown } | undefined
  if (body && typeof body.statusMessage === 'string') {
    const a = apiErrorFromResponse(status, body)
    return { message: a.message, status, issues: a.issues }
  }
  if (!status) return { message: fallback, status: 0, issues: [] }
  const words = [e.statusMessage, e.message].find((m): m is string => typeof m === 'string' && m.trim() !== '' && !BARE_DEFAULTS.has(m.trim()) && !m.startsWith('['))
  return { message: words ?? statusWords(status), status, issues: issuesIn(e.data) }
}

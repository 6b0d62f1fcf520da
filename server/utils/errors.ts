import type { ZodError, ZodIssue } from 'zod'

/** One refused field: `field` is a path spelled `levels[1].directionDeg`; `line` and `index` place it in a file or list. */
export type FieldIssue = { field: string, message: string, line?: number, index?: number }

export type DomainErrorKind = 'invalid' | 'unauthorised' | 'not-found' | 'conflict' | 'gone' | 'forbidden' | 'unavailable'

/**
 * What domain code throws instead of an HTTP error: a kind, a message a person can act on and, for refused input,
 * the issues. `defineApiHandler` turns it into the HTTP answer in one place.
 */
export class DomainError extends Error {
  readonly kind: DomainErrorKind
  readonly issues: FieldIssue[]
  constructor(kind: DomainErrorKind, message: string, issues: FieldIssue[] = []) {
    super(message)
    this.name = 'DomainError'
    this.kind = kind
    this.issues = issues
  }
}

/** HTTP status per domain error kind. */
export const DOMAIN_ERROR_STATUS: Record<DomainErrorKind, number> = {
  'invalid': 422,
  'unauthorised': 401,
  'not-found': 404,
  'conflict': 409,
  'gone': 410,
  'forbidden': 403,
  'unavailable': 503,
}

/** The one spelling of a field path: object keys joined by dots, list positions in brackets (`ends[1].designator`). */
export function fieldPath(path: ReadonlyArray<string | number>): string {
  let out = ''
  for (const part of path) {
    if (typeof part === 'number' || /^\d+$/.test(part)) out += `[${part}]`
    else out += out ? `.${part}` : part
  }
  return out
}

/** A zod issue in the contract's shape; `root` names the whole input when the path is empty. */
export function issueOf(issue: ZodIssue, root = '(body)'): FieldIssue {
  return { field: fieldPath(issue.path) || root, message: issue.message }
}

export function issuesOf(error: ZodError, root = '(body)'): FieldIssue[] {
  return error.issues.map(i => issueOf(i, root))
}

/** The plain statusMessage of a 422: the summary and the first few issues. */
export function invalidMessage(issues: FieldIssue[], summary = 'Some fields need attention'): string {
  if (!issues.length) return summary
  const shown = issues.slice(0, 3).map(i => `${i.field}: ${i.message}`).join('; ')
  return `${summary}: ${shown}${issues.length > 3 ? ` (+${issues.length - 3} more)` : ''}`
}

export function invalid(issues: FieldIssue[], message?: string): DomainError {
  return new DomainError('invalid', message ?? invalidMessage(issues), issues)
}
export function notFound(message: string): DomainError {
  return new DomainError('not-found', message)
}
/** 409; `issues` name the field that clashes (e.g. an e-mail already in use) so a form can mark it. */
export function conflict(message: string, issues: FieldIssue[] = []): DomainError {
  return new DomainError('conflict', message, issues)
}
/** 401: who is asking could not be established (bad credentials, unknown token). */
export function unauthorised(message: string): DomainError {
  return new DomainError('unauthorised', message)
}
export function gone(message: string): DomainError {
  return new DomainError('gone', message)
}
export function forbidden(message: string): DomainError {
  return new DomainError('forbidden', message)
}
/** 503: a service this needs (a local stand-in, a peer) is not answering; trying later may work. */
export function unavailable(message: string): DomainError {
  return new DomainError('unavailable', message)
}

/** Turns a zod error into a 422 whose data lists every field with its message. */
export function validationError(error: ZodError, statusMessage = 'Some fields need attention') {
  const issues = issuesOf(error)
  return createError({
    statusCode: 422,
    statusMessage: invalidMessage(issues, statusMessage),
    data: { issues },
  })
}

import type { ValidationIssue } from './types'

/** The only error the wind engine throws: a list of `{ index | line, field, message }` issues. */
export class WindValidationError extends Error {
  readonly issues: ValidationIssue[]

  constructor(issues: ValidationIssue[]) {
    const first = issues[0]
    super(issues.length === 1 && first
      ? `${first.field}: ${first.message}`
      : `${issues.length} problems in the wind data${first ? `; first: ${first.field}: ${first.message}` : ''}`)
    this.name = 'WindValidationError'
    this.issues = issues
  }
}

/** Short, throw-proof description of an unknown value for messages (String() can throw on odd objects). */
export function describeValue(value: unknown): string {
  if (typeof value === 'number') return Number.isNaN(value) ? 'NaN' : String(value)
  if (typeof value === 'string') return JSON.stringify(value.length > 40 ? `${value.slice(0, 40)}…` : value)
  if (value === null) return 'null'
  if (Array.isArray(value)) return 'a list'
  return typeof value === 'object' ? 'an object' : typeof value
}

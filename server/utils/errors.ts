import type { ZodError } from 'zod'

export type FieldIssue = { field: string, message: string, line?: number, index?: number }

/** Turns a zod error into a 422 whose data lists every field with its message. */
export function validationError(error: ZodError, statusMessage = 'Some fields need attention') {
  const issues: FieldIssue[] = error.issues.map(i => ({ field: i.path.join('.') || '(body)', message: i.message }))
  return createError({
    statusCode: 422,
    statusMessage: `${statusMessage}: ${issues.slice(0, 3).map(i => `${i.field}: ${i.message}`).join('; ')}${issues.length > 3 ? ` (+${issues.length - 3} more)` : ''}`,
    data: { issues },
  })
}

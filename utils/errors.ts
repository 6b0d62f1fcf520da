// Putting a refused form's issues beside its fields. Reading a failed call is `fetchFailure` (utils/api-error.ts).

/** A server issue's field (`ends.1.designator` or `ends[1].designator`) as the form path vee-validate uses. */
export function formPath(field: string): string {
  return field.replace(/\.(\d+)(?=\.|$)/g, '[$1]')
}

/**
 * Puts each server issue beside its field when the form has that field; returns the issues left over
 * (so the form can still list them under its failure line).
 */
export function placeIssues<P extends string>(issues: { field: string, message: string }[], fields: readonly P[], setFieldError: (path: P, message: string) => void) {
  const rest: { field: string, message: string }[] = []
  for (const i of issues) {
    const path = formPath(i.field)
    if ((fields as readonly string[]).includes(path)) setFieldError(path as P, i.message)
    else rest.push(i)
  }
  return rest
}

import { limitChangeSchema } from '../../domain/alerts/limit-sets'
import { saveLimitSet } from '../../domain/alerts/limit-change'

// The organisation's default limits. Null for a figure means the built-in default.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'safety', 'admin')
  const body = await readValidatedBody(event, limitChangeSchema.safeParse)
  if (!body.success) throw validationError(body.error, 'The limits were not changed')
  return saveLimitSet(useDB(), user, { airfieldId: null, designator: null }, body.data.values, body.data.reason)
})

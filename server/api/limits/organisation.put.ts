import { dryRunQuerySchema, limitChangeSchema } from '../../domain/alerts/limit-sets'
import { saveLimitSet } from '../../domain/alerts/limit-change'

// The organisation's default limits. Null for a figure means the built-in default. ?dryRun=1 answers the effect, saving nothing.
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-limits')
  const { dryRun } = readQuery(event, dryRunQuerySchema)
  const body = await readBodyWith(event, limitChangeSchema, 'The limits were not changed')
  return saveLimitSet(useDB(), user, { airfieldId: null, designator: null }, body.values, body.reason, { dryRun })
})

import { z } from 'zod'
import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { dryRunQuerySchema, limitChangeSchema } from '../../../domain/alerts/limit-sets'
import { saveLimitSet } from '../../../domain/alerts/limit-change'
import { loadAirfield } from '../../../domain/airfields/lookup'
import { requireRunwayEnd } from '../../../domain/alerts/limit-views'

const bodySchema = limitChangeSchema.extend({
  // Set to override one runway end only; omit for the whole airfield.
  designator: z.string().trim().toUpperCase().regex(/^(0[1-9]|[12]\d|3[0-6])[LCR]?$/, 'Runway end must be a designator such as 18 or 09L').optional(),
})

// An airfield's override (or one runway end's). Null for a figure means "inherit".
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-limits')
  const { code } = readParams(event, airfieldCodeParamSchema)
  const { dryRun } = readQuery(event, dryRunQuerySchema)
  const body = await readBodyWith(event, bodySchema, 'The limits were not changed')
  const airfield = await loadAirfield(code)
  const designator = body.designator ?? null
  if (designator) await requireRunwayEnd(airfield, designator)
  return saveLimitSet(useDB(), user, { airfieldId: airfield.id, designator }, body.values, body.reason, { dryRun })
})

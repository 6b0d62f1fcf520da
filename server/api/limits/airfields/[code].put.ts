import { z } from 'zod'
import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { limitChangeSchema } from '../../../domain/alerts/limit-sets'
import { saveLimitSet } from '../../../domain/alerts/limit-change'
import { loadAirfield } from '../../../domain/airfields/lookup'

const bodySchema = limitChangeSchema.extend({
  // Set to override one runway end only; omit for the whole airfield.
  designator: z.string().trim().toUpperCase().regex(/^(0[1-9]|[12]\d|3[0-6])[LCR]?$/, 'Runway end must be a designator such as 18 or 09L').optional(),
})

// An airfield's override (or one runway end's). Null for a figure means "inherit".
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-limits')
  const { code } = readParams(event, airfieldCodeParamSchema)
  const body = await readBodyWith(event, bodySchema, 'The limits were not changed')
  const airfield = await loadAirfield(code)
  const designator = body.designator ?? null
  if (designator) {
    const [end] = await useDB().select({ id: schema.runwayEnds.id }).from(schema.runwayEnds)
      .where(and(eq(schema.runwayEnds.airfieldId, airfield.id), eq(schema.runwayEnds.designator, designator)))
    if (!end) throw createError({ statusCode: 422, statusMessage: `${code} has no runway end ${designator}`, data: { issues: [{ field: 'designator', message: `${code} has no runway end ${designator}` }] } })
  }
  return saveLimitSet(useDB(), user, { airfieldId: airfield.id, designator }, body.values, body.reason)
})

import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { trendQuerySchema } from '#shared/utils/briefing-schemas'
import { loadAirfieldWithEnds } from '../../../domain/briefings/briefing'
import { loadTrend } from '../../../domain/briefings/trend'

// The day's profiles of an airfield over time: strongest shear and each runway end's surface crosswind and tailwind.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'admin', 'dispatcher', 'pilot', 'safety')
  const params = await getValidatedRouterParams(event, airfieldCodeParamSchema.safeParse)
  if (!params.success) throw validationError(params.error, 'The airfield code is not valid')
  const query = await getValidatedQuery(event, trendQuerySchema.safeParse)
  if (!query.success) throw validationError(query.error, 'The trend query is not valid')
  const { airfield, ends } = await loadAirfieldWithEnds(params.data.code)
  return { ...(await loadTrend(airfield, ends, query.data.date)), caution: VEERLINE_CAUTION }
})

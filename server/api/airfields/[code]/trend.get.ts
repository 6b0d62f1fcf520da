import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { trendQuerySchema } from '#shared/utils/briefing-schemas'
import { loadAirfieldWithEnds } from '../../../domain/briefings/briefing'
import { loadTrend } from '../../../domain/briefings/trend'

// The day's profiles of an airfield over time: strongest shear and each runway end's surface crosswind and tailwind.
export default defineApiHandler(async (event) => {
  await requireCapability(event, 'read-briefings')
  const params = readParams(event, airfieldCodeParamSchema)
  const query = readQuery(event, trendQuerySchema)
  const { airfield, ends } = await loadAirfieldWithEnds(params.code)
  return { ...(await loadTrend(airfield, ends, query.date)), caution: VEERLINE_CAUTION }
})

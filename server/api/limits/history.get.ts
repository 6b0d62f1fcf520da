import { airfieldCodeField } from '#shared/utils/airfield-schema'
import { z } from 'zod'
import { decimalIntSchema } from '#shared/utils/input-schemas'
import { loadAirfield } from '../../domain/airfields/lookup'
import { limitHistory } from '../../domain/alerts/limit-views'

const querySchema = z.object({ airfield: airfieldCodeField('Airfield').optional(), limit: decimalIntSchema('limit', 1, 500).default(100) })

// Who changed which limits when, why, and from what to what.
export default defineApiHandler(async (event) => {
  await requireCapability(event, 'manage-limits')
  const query = readQuery(event, querySchema)
  const airfield = query.airfield ? await loadAirfield(query.airfield) : null
  return { changes: await limitHistory({ airfieldId: airfield?.id, limit: query.limit }) }
})

import { z } from 'zod'
import { airfieldCodeField } from '#shared/utils/airfield-schema'
import { pageSchema, pageSizeSchema } from '#shared/utils/input-schemas'
import { loadAirfield } from '../../../domain/airfields/lookup'
import { inboxOf } from '../../../domain/alerts/inbox'

const querySchema = z.object({
  airfield: airfieldCodeField('Airfield').optional(),
  kind: z.string().trim().regex(/^[a-z-]{1,32}$/, 'kind must be an alert kind such as crosswind').optional(),
  unacknowledged: z.enum(['1', '0', 'true', 'false'], { errorMap: () => ({ message: 'unacknowledged must be 1 or 0' }) }).optional()
    .transform(v => v === '1' || v === 'true'),
  page: pageSchema,
  pageSize: pageSizeSchema(200, 50),
})

// The signed-in user's alerts inbox, newest first, filtered (airfield, kind, unacknowledged) and paged, with the
// count not yet acknowledged.
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const query = readQuery(event, querySchema)
  const airfield = query.airfield ? await loadAirfield(query.airfield) : null
  return inboxOf(user.id, { airfieldId: airfield?.id, kind: query.kind, unacknowledged: query.unacknowledged, page: query.page, pageSize: query.pageSize })
})

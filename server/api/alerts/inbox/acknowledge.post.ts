import { z } from 'zod'
import { airfieldCodeField } from '#shared/utils/airfield-schema'
import { idSchema } from '#shared/utils/input-schemas'
import { loadAirfield } from '../../../domain/airfields/lookup'
import { acknowledgeInboxEntries } from '../../../domain/alerts/inbox'

const bodySchema = z.object({
  airfieldCode: airfieldCodeField('Airfield').optional(),
  ids: z.array(idSchema(), { invalid_type_error: 'ids must be a list of inbox entry numbers' })
    .min(1, 'Give at least one inbox entry').max(500, 'Acknowledge at most 500 entries at once').optional(),
}).strict().refine(v => (v.airfieldCode == null) !== (v.ids == null), { message: 'Give either airfieldCode or ids', path: ['airfieldCode'] })

// Acknowledges many of the signed-in user's own inbox entries: all of one airfield's, or a list of ids (a group).
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const body = await readBodyWith(event, bodySchema, 'Nothing was acknowledged')
  if (body.ids) return acknowledgeInboxEntries(user.id, { ids: body.ids })
  const airfield = await loadAirfield(body.airfieldCode!)
  return acknowledgeInboxEntries(user.id, { airfieldId: airfield.id })
})

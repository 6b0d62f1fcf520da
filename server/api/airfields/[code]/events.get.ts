import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { readAirfieldStamp, streamAirfieldEvents } from '../../../domain/briefings/events'

// Live briefing: Server-Sent Events for one airfield (a profile filed, superseded or withdrawn, a limit or runway
// changed; the reader's open alert count), read from the database so every app instance sees every change.
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'read-briefings')
  const { code } = readParams(event, airfieldCodeParamSchema)
  const first = await readAirfieldStamp(code, user.id)
  if (!first) throw notFound(`No airfield with the code ${code.toUpperCase()}`)
  const lastEventId = getRequestHeader(event, 'last-event-id') ?? null
  return streamAirfieldEvents(event, code, user.id, first, lastEventId && lastEventId.length <= 400 ? lastEventId : null)
})

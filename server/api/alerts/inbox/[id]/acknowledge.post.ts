import { idParamSchema } from '#shared/utils/schemas'
import { acknowledgeInboxEntry } from '../../../../domain/alerts/inbox'

// Acknowledges one of the signed-in user's own inbox entries (404 for anyone else's).
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const { id } = readParams(event, idParamSchema)
  return acknowledgeInboxEntry(user.id, id)
})

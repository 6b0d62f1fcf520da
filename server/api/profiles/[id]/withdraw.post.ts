import { idParamSchema } from '#shared/utils/schemas'
import { withdrawSchema } from '#shared/utils/profile-schema'
import { withdrawProfile } from '../../../domain/profiles/records'

// Withdraws an active profile with a reason; it stays, marked. The airfield's alerts are evaluated in the same transaction.
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'withdraw-profile')
  const { id } = readParams(event, idParamSchema)
  const body = await readBodyWith(event, withdrawSchema)
  return { profile: await withdrawProfile(user, id, body.reason) }
})

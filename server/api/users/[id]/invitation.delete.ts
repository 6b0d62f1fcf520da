import { idParamSchema } from '#shared/utils/schemas'
import { revokeInvitation } from '../../../domain/accounts/invitations'

// Withdraws a pending invitation: its link answers 410 from now on and the account stays disabled.
export default defineApiHandler(async (event) => {
  const admin = await requireCapability(event, 'manage-users')
  const { id } = readParams(event, idParamSchema)
  return revokeInvitation(admin, id)
})

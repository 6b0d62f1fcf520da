import { listPendingInvitations } from '../../domain/accounts/invitations'

// The invitations still waiting (admin): who, role, invited by, sent at, expires.
export default defineApiHandler(async (event) => {
  await requireCapability(event, 'manage-users')
  return { invitations: await listPendingInvitations() }
})

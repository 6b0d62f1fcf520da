import { z } from 'zod'
import { invitationFor } from '../../domain/accounts/invitations'

// Public: what an invitation link is for, so the page can greet the person.
export default defineApiHandler(async (event) => {
  const { token } = readParams(event, z.object({ token: z.string().max(100, 'The invitation link is too long') }))
  return invitationFor(token)
})

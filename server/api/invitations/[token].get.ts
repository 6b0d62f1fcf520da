import { z } from 'zod'
import { findLiveToken } from '../../domain/accounts/tokens'

// Public: what an invitation link is for, so the page can greet the person. 404 when used, expired or unknown.
export default defineApiHandler(async (event) => {
  const { token } = readParams(event, z.object({ token: z.string().max(100, 'The invitation link is too long') }))
  const row = await findLiveToken(useDB(), 'invitation', token)
  if (!row) throw createError({ statusCode: 404, statusMessage: 'This invitation link is not valid any more (used, expired or unknown); ask an administrator for a new one' })
  return { email: row.user.email, name: row.user.name, expiresAt: row.token.expiresAt.toISOString() }
})

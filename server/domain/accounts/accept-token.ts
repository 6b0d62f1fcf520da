import { z } from 'zod'
import { newPasswordSchema } from '../../../shared/utils/schemas'
import { eq, schema, transaction } from '../../utils/db'
import { recordAudit } from '../../utils/audit'
import { gone } from '../../utils/errors'
import { findLiveToken, type TokenPurpose } from './tokens'
import { endUserSessions } from './session-store'

export const acceptTokenSchema = z.object({ token: z.string({ required_error: 'token is required' }).max(100), password: newPasswordSchema })

/** Sets the password from a single-use token; answers the user, whom the route then signs in. */
export async function acceptToken(purpose: TokenPurpose, body: z.infer<typeof acceptTokenSchema>) {
  const passwordHash = await hashPassword(body.password)
  const user = await transaction(async (tx) => {
    const row = await findLiveToken(tx, purpose, body.token, true)
    if (!row || row.user.disabled) throw gone('This link is not valid any more (used, expired or unknown); ask for a new one')
    await tx.update(schema.userTokens).set({ usedAt: new Date() }).where(eq(schema.userTokens.id, row.token.id))
    await tx.update(schema.users).set({ passwordHash, updatedAt: new Date() }).where(eq(schema.users.id, row.user.id))
    await recordAudit(tx, { user: row.user }, purpose === 'invitation' ? 'user.accept-invitation' : 'user.reset-password', 'user', row.user.id)
    // A new password ends every session the account had (someone else may have been signed in with the old one).
    await endUserSessions(row.user.id, tx)
    return row.user
  })
  return user
}

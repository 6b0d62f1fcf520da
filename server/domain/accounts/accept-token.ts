import type { H3Event } from 'h3'
import { z } from 'zod'
import { newPasswordSchema } from '../../../shared/utils/schemas'
import { eq, schema, useDB } from '../../utils/db'
import { recordAudit } from '../../utils/audit'
import { sessionUser } from '../../utils/auth'
import { validationError } from '../../utils/errors'
import { findLiveToken, type TokenPurpose } from './tokens'

export const acceptTokenSchema = z.object({ token: z.string({ required_error: 'token is required' }).max(100), password: newPasswordSchema })

/** Sets the password from a single-use token and signs the person in. */
export async function acceptToken(event: H3Event, purpose: TokenPurpose) {
  const body = await readValidatedBody(event, acceptTokenSchema.safeParse)
  if (!body.success) throw validationError(body.error, 'The password was not set')
  const passwordHash = await hashPassword(body.data.password)
  const user = await useDB().transaction(async (tx) => {
    const row = await findLiveToken(tx, purpose, body.data.token, true)
    if (!row || row.user.disabled) throw createError({ statusCode: 410, statusMessage: 'This link is not valid any more (used, expired or unknown); ask for a new one' })
    await tx.update(schema.userTokens).set({ usedAt: new Date() }).where(eq(schema.userTokens.id, row.token.id))
    await tx.update(schema.users).set({ passwordHash, updatedAt: new Date() }).where(eq(schema.users.id, row.user.id))
    await recordAudit(tx, { user: row.user }, purpose === 'invitation' ? 'user.accept-invitation' : 'user.reset-password', 'user', row.user.id)
    return row.user
  })
  await replaceUserSession(event, { user: sessionUser(user), signedInAt: new Date().toISOString() })
  return { user: sessionUser(user) }
}

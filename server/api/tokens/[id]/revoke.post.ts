import { idParamSchema } from '#shared/utils/schemas'

// Revokes a token for good (the row stays, marked). A dispatcher revokes their own; an admin any.
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-tokens')
  const { id } = readParams(event, idParamSchema)
  const t = schema.apiTokens
  const revoked = await useDB().transaction(async (tx) => {
    const scope = and(eq(t.id, id), isNull(t.revokedAt), user.role === 'admin' ? undefined : eq(t.createdByUserId, user.id))
    const [row] = await tx.select().from(t).where(scope).for('update')
    if (!row) return null
    const at = new Date()
    await tx.update(t).set({ revokedAt: at, revokedByUserId: user.id }).where(scope)
    await recordAudit(tx, { user }, 'api-token.revoke', 'api-token', id, { name: row.name, tokenPrefix: row.tokenPrefix })
    return { id, name: row.name, revokedAt: at.toISOString() }
  })
  if (!revoked) throw createError({ statusCode: 404, statusMessage: `No live API token ${id} of yours` })
  return { token: revoked }
})

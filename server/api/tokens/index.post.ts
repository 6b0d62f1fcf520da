import { tokenCreateSchema } from '#shared/utils/profile-schema'
import { newApiToken } from '../../domain/accounts/api-tokens'

// Makes an API token for a feed. The answer carries the token once; only its SHA-256 is stored.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'dispatcher', 'admin')
  const body = await readValidatedBody(event, tokenCreateSchema.safeParse)
  if (!body.success) throw validationError(body.error)
  const { token, tokenHash, tokenPrefix } = newApiToken()
  const id = await useDB().transaction(async (tx) => {
    const [row] = await tx.insert(schema.apiTokens).values({ name: body.data.name, tokenHash, tokenPrefix, createdByUserId: user.id }).$returningId()
    await recordAudit(tx, { user }, 'api-token.create', 'api-token', row!.id, { name: body.data.name, tokenPrefix })
    return row!.id
  })
  setResponseStatus(event, 201)
  return { token: { id, name: body.data.name, tokenPrefix, secret: token } }
})

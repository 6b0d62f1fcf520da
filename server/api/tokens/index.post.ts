import { tokenCreateSchema } from '#shared/utils/profile-schema'
import { newApiToken } from '../../domain/accounts/api-tokens'

// Makes an API token for a feed. The answer carries the token once; only its SHA-256 is stored.
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-tokens')
  const body = await readBodyWith(event, tokenCreateSchema)
  const { token, tokenHash, tokenPrefix } = newApiToken()
  const id = await useDB().transaction(async (tx) => {
    const [row] = await tx.insert(schema.apiTokens).values({ name: body.name, tokenHash, tokenPrefix, createdByUserId: user.id }).$returningId()
    await recordAudit(tx, { user }, 'api-token.create', 'api-token', row!.id, { name: body.name, tokenPrefix })
    return row!.id
  })
  setResponseStatus(event, 201)
  return { token: { id, name: body.name, tokenPrefix, secret: token } }
})

import { tokenCreateSchema } from '#shared/utils/profile-schema'
import { createApiToken } from '../../domain/accounts/api-tokens'

export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-tokens')
  const body = await readBodyWith(event, tokenCreateSchema)
  const token = await createApiToken(user, body.name)
  setResponseStatus(event, 201)
  return { token }
})

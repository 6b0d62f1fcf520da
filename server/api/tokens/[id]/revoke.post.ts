import { idParamSchema } from '#shared/utils/schemas'
import { revokeApiToken } from '../../../domain/accounts/api-tokens'

export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-tokens')
  const { id } = readParams(event, idParamSchema)
  return { token: await revokeApiToken(user, id) }
})

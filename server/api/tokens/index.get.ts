import { listApiTokens } from '../../domain/accounts/api-tokens'

export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-tokens')
  return { tokens: await listApiTokens(user) }
})

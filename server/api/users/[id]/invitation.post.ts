import { idParamSchema } from '#shared/utils/schemas'
import { resendInvitation } from '../../../domain/accounts/invitations'

// Sends the invited person a new link; the earlier link stops working (410).
export default defineApiHandler(async (event) => {
  const admin = await requireCapability(event, 'manage-users')
  const { id } = readParams(event, idParamSchema)
  const appUrl = process.env.NUXT_PUBLIC_APP_URL || useRuntimeConfig().public.appUrl
  return resendInvitation(admin, id, appUrl)
})

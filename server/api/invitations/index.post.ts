import { z } from 'zod'
import { emailSchema, roleSchema } from '#shared/utils/schemas'
import { inviteUser } from '../../domain/accounts/invitations'

const bodySchema = z.object({ email: emailSchema, name: z.string().trim().min(1, 'Name is required').max(120), role: roleSchema })

export default defineApiHandler(async (event) => {
  const admin = await requireCapability(event, 'manage-users')
  const body = await readBodyWith(event, bodySchema, 'The invitation was not sent')
  const appUrl = process.env.NUXT_PUBLIC_APP_URL || useRuntimeConfig().public.appUrl
  const invitation = await inviteUser(admin, body, appUrl)
  setResponseStatus(event, 201)
  return invitation
})

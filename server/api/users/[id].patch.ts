import { idParamSchema, updateUserSchema } from '#shared/utils/schemas'
import { updateUser } from '../../domain/accounts/users'

export default defineApiHandler(async (event) => {
  const admin = await requireCapability(event, 'manage-users')
  const { id } = readParams(event, idParamSchema)
  const body = await readBodyWith(event, updateUserSchema)
  return { user: await updateUser(admin, id, body) }
})

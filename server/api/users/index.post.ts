import { createUserSchema } from '#shared/utils/schemas'
import { createUser } from '../../domain/accounts/users'

export default defineApiHandler(async (event) => {
  const admin = await requireCapability(event, 'manage-users')
  const body = await readBodyWith(event, createUserSchema)
  const user = await createUser(admin, body)
  setResponseStatus(event, 201)
  return { user }
})

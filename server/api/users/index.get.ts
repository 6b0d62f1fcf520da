import { listUsers } from '../../domain/accounts/users'

export default defineApiHandler(async (event) => {
  await requireCapability(event, 'manage-users')
  return { users: await listUsers() }
})

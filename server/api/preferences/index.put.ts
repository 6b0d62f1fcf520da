import { preferencesSchema } from '#shared/utils/preferences-schema'
import { savePreferences } from '../../domain/accounts/preferences'

// Changes some or all of the signed-in user's display preferences; answers the whole set.
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const body = await readBodyWith(event, preferencesSchema, 'The preferences are not valid')
  return { preferences: await savePreferences(user.id, body) }
})

import { preferencesSchema } from '#shared/utils/preferences-schema'
import { preferencesOf } from '../../domain/accounts/preferences'

// Changes some or all of the signed-in user's display preferences; answers the whole set.
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const body = await readBodyWith(event, preferencesSchema, 'The preferences are not valid')
  const next = { ...(await preferencesOf(user.id)), ...body }
  await useDB().insert(schema.userPreferences).values({ userId: user.id, ...next, updatedAt: new Date() })
    .onDuplicateKeyUpdate({ set: { ...next, updatedAt: new Date() } })
  return { preferences: next }
})

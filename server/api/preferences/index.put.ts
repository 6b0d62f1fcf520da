import { preferencesSchema } from '#shared/utils/preferences-schema'
import { preferencesOf } from '../../domain/accounts/preferences'

// Changes some or all of the signed-in user's display preferences; answers the whole set.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const body = await readValidatedBody(event, preferencesSchema.safeParse)
  if (!body.success) throw validationError(body.error, 'The preferences are not valid')
  const next = { ...(await preferencesOf(user.id)), ...body.data }
  await useDB().insert(schema.userPreferences).values({ userId: user.id, ...next, updatedAt: new Date() })
    .onDuplicateKeyUpdate({ set: { ...next, updatedAt: new Date() } })
  return { preferences: next }
})

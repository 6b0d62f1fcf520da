import { DEFAULT_PREFERENCES, type DisplayPreferences } from '../../../shared/utils/display-units'
import { eq, schema, useDB } from '../../utils/db'

export async function preferencesOf(userId: number): Promise<DisplayPreferences> {
  const [row] = await useDB().select().from(schema.userPreferences).where(eq(schema.userPreferences.userId, userId))
  return row ? { speedUnit: row.speedUnit, heightUnit: row.heightUnit, headingRef: row.headingRef } : { ...DEFAULT_PREFERENCES }
}

/** Changes some or all of the user's display preferences; answers the whole set. */
export async function savePreferences(userId: number, change: Partial<DisplayPreferences>): Promise<DisplayPreferences> {
  const next = { ...(await preferencesOf(userId)), ...change }
  await useDB().insert(schema.userPreferences).values({ userId, ...next, updatedAt: new Date() })
    .onDuplicateKeyUpdate({ set: { ...next, updatedAt: new Date() } })
  return next
}

import { DEFAULT_PREFERENCES, type DisplayPreferences } from '../../../shared/utils/display-units'
import { eq, schema, useDB } from '../../utils/db'

export async function preferencesOf(userId: number): Promise<DisplayPreferences> {
  const [row] = await useDB().select().from(schema.userPreferences).where(eq(schema.userPreferences.userId, userId))
  return row ? { speedUnit: row.speedUnit, heightUnit: row.heightUnit, headingRef: row.headingRef } : { ...DEFAULT_PREFERENCES }
}

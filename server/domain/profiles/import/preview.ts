import type { Airfield } from '../../../db/schema'
import { eq, schema, useDB } from '../../../utils/db'
import type { FieldIssue } from '../../../utils/errors'
import { checkProfile, type LineOf } from '../filing'

/**
 * What filing a parsed file would do, saving nothing: its parse issues, or, when it parsed, the engine's check with
 * each refusal placed on its line, and the warnings the filing would carry.
 */
export async function previewImport(airfield: Airfield, input: unknown, parseIssues: FieldIssue[], lineOf: LineOf) {
  if (parseIssues.length) return { issues: parseIssues, warnings: [] as unknown[] }
  const ends = await useDB().select().from(schema.runwayEnds).where(eq(schema.runwayEnds.airfieldId, airfield.id))
  try {
    return { issues: [] as FieldIssue[], warnings: checkProfile(airfield, ends, input, lineOf).analysis.warnings as unknown[] }
  }
  catch (err) {
    const issues = (err as { data?: { issues?: FieldIssue[] } }).data?.issues ?? (err as { issues?: FieldIssue[] }).issues
    if (!issues?.length) throw err
    return { issues, warnings: [] as unknown[] }
  }
}

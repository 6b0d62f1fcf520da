import type { Airfield } from '../../../db/schema'
import { CSV_COLUMN_OF } from './csv'
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

const LEVEL_FIELD_RE = /^levels\[(\d+)\](?:\.(\w+))?$/

/**
 * Issues in the file's own words: a level field becomes the file's column (`direction_deg` in a CSV, the JSON key in a
 * JSON file) on the file's line, and "level N" in a message becomes that line. Never an internal path.
 */
export function inFileWords(issues: FieldIssue[], format: 'csv' | 'json', lineOf: LineOf): FieldIssue[] {
  const lineText = (index: number) => {
    const line = lineOf(index)
    return line === undefined ? `level ${index + 1}` : `line ${line}`
  }
  return issues.map((i) => {
    const m = LEVEL_FIELD_RE.exec(i.field)
    const message = i.message.replace(/levels\[(\d+)\]/g, (_, k: string) => lineText(Number(k)))
    if (!m) return { ...i, message }
    const index = Number(m[1])
    const key = m[2]
    const field = key ? (format === 'csv' ? CSV_COLUMN_OF[key] ?? key : key) : 'line'
    const line = i.line ?? lineOf(index)
    return { field, message, index, ...(line === undefined ? {} : { line }) }
  })
}

/** The parsed rows as the file has them: its columns (CSV names or JSON keys) and each row with its line. */
export function fileRows(levels: unknown[], lines: number[], format: 'csv' | 'json') {
  const name = (key: string) => (format === 'csv' ? CSV_COLUMN_OF[key] ?? key : key)
  const objects = levels.map(l => (l && typeof l === 'object' ? l as Record<string, unknown> : {}))
  const columns = [...new Set(objects.flatMap(l => Object.keys(l)))].map(name)
  return {
    columns,
    rows: objects.map((l, k) => ({ line: lines[k] ?? null, cells: Object.fromEntries(Object.entries(l).map(([key, v]) => [name(key), v])) })),
  }
}

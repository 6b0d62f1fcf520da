// CSV of profile levels (README "CSV columns"): one header row, then one level per line.
// Plain TypeScript: text in, levels out, every problem with its 1-based line number.
import type { ProfileLevelInput } from '../../../../shared/utils/profile-schema'
import { PROFILE_MAX_LEVELS } from '../../../../shared/utils/profile-schema'

export type ImportIssue = { line: number, field: string, message: string }
export type ParsedLevels = { levels: ProfileLevelInput[], lines: number[], issues: ImportIssue[] }

const COLUMN_KEYS: Record<string, keyof ProfileLevelInput> = {
  height_m: 'heightM', height_ft: 'heightFt', pressure_hpa: 'pressureHpa', direction_deg: 'directionDeg',
  speed_kt: 'speedKt', speed_mps: 'speedMps', gust_kt: 'gustKt', gust_mps: 'gustMps', temperature_c: 'temperatureC',
}
export const CSV_COLUMNS = Object.keys(COLUMN_KEYS)
/** The file's own column for each level field (`directionDeg` → `direction_deg`). */
export const CSV_COLUMN_OF: Record<string, string> = Object.fromEntries(Object.entries(COLUMN_KEYS).map(([column, key]) => [key, column]))
const GROUPS = [
  // A height column (height_m or height_ft), a pressure_hpa column, or both (the height wins where both are filled).
  { name: 'height', columns: ['height_m', 'height_ft'], required: false },
  { name: 'direction', columns: ['direction_deg'], required: true },
  { name: 'speed', columns: ['speed_kt', 'speed_mps'], required: true },
  { name: 'gust', columns: ['gust_kt', 'gust_mps'], required: false },
]

/** Splits one line on commas (or semicolons), honouring double quotes. */
function cells(line: string, separator: string): string[] {
  const out: string[] = []
  let cur = ''
  let quoted = false
  for (let i = 0; i < line.length; i++) {
    const ch = line[i]!
    if (quoted) {
      if (ch === '"' && line[i + 1] === '"') {
        cur += '"'
        i++
      }
      else if (ch === '"') quoted = false
      else cur += ch
    }
    else if (ch === '"') quoted = true
    else if (ch === separator) {
      out.push(cur.trim())
      cur = ''
    }
    else cur += ch
  }
  out.push(cur.trim())
  return out
}

export function parseProfileCsv(text: string): ParsedLevels {
  const levels: ProfileLevelInput[] = []
  const lines: number[] = []
  const issues: ImportIssue[] = []
  const rows = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/)
  let header: string[] | null = null
  let separator = ','
  for (let i = 0; i < rows.length; i++) {
    const lineNo = i + 1
    const raw = rows[i]!
    if (raw.trim() === '' || raw.trimStart().startsWith('#')) continue
    if (!header) {
      separator = raw.includes(';') && !raw.includes(',') ? ';' : ','
      header = cells(raw, separator).map(c => c.toLowerCase())
      // Own keys only: `__proto__` or `constructor` are not columns, whatever Object.prototype holds.
      const unknown = header.filter(c => !Object.hasOwn(COLUMN_KEYS, c))
      if (unknown.length) issues.push({ line: lineNo, field: 'header', message: `unknown column ${unknown.map(u => `"${u}"`).join(', ')}; the columns are ${CSV_COLUMNS.join(', ')}` })
      for (const g of GROUPS) {
        const present = g.columns.filter(c => header!.includes(c))
        if (g.required && present.length !== 1) issues.push({ line: lineNo, field: 'header', message: present.length ? `give one ${g.name} column, not ${present.join(' and ')}` : `a ${g.name} column is needed (${g.columns.join(' or ')})` })
        if (!g.required && present.length > 1) issues.push({ line: lineNo, field: 'header', message: `give at most one ${g.name} column, not ${present.join(' and ')}` })
      }
      if (!header.some(c => c === 'height_m' || c === 'height_ft' || c === 'pressure_hpa')) {
        issues.push({ line: lineNo, field: 'header', message: 'a height column is needed (height_m, height_ft or pressure_hpa)' })
      }
      const dup = header.find((c, k) => header!.indexOf(c) !== k)
      if (dup) issues.push({ line: lineNo, field: 'header', message: `column "${dup}" appears twice` })
      if (issues.length) return { levels, lines, issues }
      continue
    }
    const values = cells(raw, separator)
    if (values.length !== header.length) {
      issues.push({ line: lineNo, field: 'line', message: `${values.length} values, but the header has ${header.length} columns` })
      continue
    }
    const level: Record<string, number> = {}
    header.forEach((column, k) => {
      const v = values[k]!
      if (v === '') {
        // Optional cells: a gust, a temperature, and one of a height and a pressure when both columns exist.
        if (column.startsWith('gust_') || column === 'temperature_c') return
        if ((column === 'pressure_hpa' && header!.some(c => c === 'height_m' || c === 'height_ft')) || (column !== 'pressure_hpa' && column.startsWith('height_') && header!.includes('pressure_hpa'))) return
        issues.push({ line: lineNo, field: column, message: `${column} is empty` })
        return
      }
      const n = Number(v)
      if (!Number.isFinite(n) || !/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(v)) {
        issues.push({ line: lineNo, field: column, message: `${column} must be a number, got "${v.slice(0, 20)}"` })
        return
      }
      level[COLUMN_KEYS[column]!] = n
    })
    levels.push(level as ProfileLevelInput)
    lines.push(lineNo)
  }
  if (!header) issues.push({ line: 1, field: 'header', message: `the file is empty: a header row (${CSV_COLUMNS.join(', ')}) and levels are needed` })
  if (levels.length > PROFILE_MAX_LEVELS) issues.push({ line: lines[PROFILE_MAX_LEVELS]!, field: 'levels', message: `at most ${PROFILE_MAX_LEVELS} levels, the file has ${levels.length}` })
  return { levels, lines, issues }
}

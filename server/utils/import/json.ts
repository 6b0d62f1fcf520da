// A profile as a JSON file, in the public shape (README "Profile JSON"); the line of each level is kept
// so that problems name the line. Plain TypeScript.
import type { ProfileLevelInput } from '../../../shared/utils/profile-schema'
import type { ImportIssue } from './csv'

export type ParsedJsonProfile = {
  header: Record<string, unknown>
  levels: unknown[]
  lines: number[]
  issues: ImportIssue[]
}

function lineAt(text: string, position: number): number {
  let line = 1
  for (let i = 0; i < position && i < text.length; i++) if (text.charCodeAt(i) === 10) line++
  return line
}

/** Lines where each element of the top-level "levels" array starts. */
function levelLines(text: string): number[] {
  const lines: number[] = []
  let line = 1
  let depth = 0
  let inString = false
  let str = ''
  let lastKeyAtTop = ''
  let levelsDepth = -1
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!
    if (ch === '\n') line++
    if (inString) {
      if (ch === '\\') {
        i++
        continue
      }
      if (ch === '"') {
        inString = false
        if (depth === 1) lastKeyAtTop = str
      }
      else str += ch
      continue
    }
    if (ch === '"') {
      inString = true
      str = ''
    }
    else if (ch === '{' || ch === '[') {
      if (levelsDepth >= 0 && depth === levelsDepth) lines.push(line)
      if (ch === '[' && depth === 1 && lastKeyAtTop === 'levels' && levelsDepth < 0) levelsDepth = 2
      depth++
    }
    else if (ch === '}' || ch === ']') {
      depth--
      if (levelsDepth >= 0 && depth < levelsDepth) levelsDepth = -2
    }
    else if (levelsDepth >= 0 && depth === levelsDepth && /[-\d"tfn]/.test(ch) && !/[\s,]/.test(ch)) {
      // a bare value in the array (not an object): still one element
      lines.push(line)
      while (i + 1 < text.length && !/[,\]\s]/.test(text[i + 1]!)) i++
    }
  }
  return lines
}

export function parseProfileJson(text: string): ParsedJsonProfile {
  let value: unknown
  try {
    value = JSON.parse(text.replace(/^\uFEFF/, ''))
  }
  catch (err) {
    const message = (err as Error).message
    const pos = /position (\d+)/.exec(message)
    return { header: {}, levels: [], lines: [], issues: [{ line: pos ? lineAt(text, Number(pos[1])) : 1, field: 'file', message: `not valid JSON: ${message}` }] }
  }
  // A bare array is a list of levels; an object is a profile.
  if (Array.isArray(value)) return { header: {}, levels: value, lines: levelLines(`{"levels":${text}}`), issues: [] }
  if (typeof value !== 'object' || value === null) return { header: {}, levels: [], lines: [], issues: [{ line: 1, field: 'file', message: 'a profile object or a list of levels is needed' }] }
  const { levels, ...header } = value as Record<string, unknown>
  if (!Array.isArray(levels)) return { header, levels: [], lines: [], issues: [{ line: 1, field: 'levels', message: 'a "levels" list is needed' }] }
  return { header, levels: levels as ProfileLevelInput[], lines: levelLines(text), issues: [] }
}

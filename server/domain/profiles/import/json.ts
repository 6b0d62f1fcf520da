// A profile as a JSON file, in the public shape (README "Profile JSON"); the line of each level is kept
// so that problems name the line. Plain TypeScript.
import type { ProfileLevelInput } from '../../../../shared/utils/profile-schema'
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

/** Offset of the first syntax error in a JSON text (a small recursive-descent check), or -1 when it is valid. */
export function jsonErrorOffset(text: string): number {
  let i = 0
  const ws = () => {
    while (i < text.length && /\s/.test(text[i]!)) i++
  }
  const fail = (): never => {
    throw i
  }
  const value = (): void => {
    ws()
    const ch = text[i]
    if (ch === '{') {
      i++
      ws()
      if (text[i] === '}') {
        i++
        return
      }
      for (;;) {
        ws()
        if (text[i] !== '"') fail()
        string()
        ws()
        if (text[i] !== ':') fail()
        i++
        value()
        ws()
        if (text[i] === ',') i++
        else if (text[i] === '}') {
          i++
          return
        }
        else fail()
      }
    }
    if (ch === '[') {
      i++
      ws()
      if (text[i] === ']') {
        i++
        return
      }
      for (;;) {
        value()
        ws()
        if (text[i] === ',') i++
        else if (text[i] === ']') {
          i++
          return
        }
        else fail()
      }
    }
    if (ch === '"') return string()
    const m = /^(-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?|true|false|null)/.exec(text.slice(i, i + 400))
    if (!m) fail()
    i += m![0].length
  }
  const string = () => {
    i++
    while (i < text.length && text[i] !== '"') {
      if (text[i] === '\\') i++
      else if (text.charCodeAt(i) < 0x20) fail()
      i++
    }
    if (i >= text.length) fail()
    i++
  }
  try {
    value()
    ws()
    return i < text.length ? i : -1
  }
  catch (at) {
    return typeof at === 'number' ? at : 0
  }
}

export function parseProfileJson(text: string): ParsedJsonProfile {
  let value: unknown
  try {
    value = JSON.parse(text.replace(/^\uFEFF/, ''))
  }
  catch (err) {
    const message = (err as Error).message
    const at = jsonErrorOffset(text.replace(/^\uFEFF/, ''))
    return { header: {}, levels: [], lines: [], issues: [{ line: lineAt(text, Math.max(at, 0)), field: 'file', message: `not valid JSON: ${message}` }] }
  }
  // A bare array is a list of levels; an object is a profile.
  if (Array.isArray(value)) return { header: {}, levels: value, lines: levelLines(`{"levels":${text}}`), issues: [] }
  if (typeof value !== 'object' || value === null) return { header: {}, levels: [], lines: [], issues: [{ line: 1, field: 'file', message: 'a profile object or a list of levels is needed' }] }
  const { levels, ...header } = value as Record<string, unknown>
  if (!Array.isArray(levels)) return { header, levels: [], lines: [], issues: [{ line: 1, field: 'levels', message: 'a "levels" list is needed' }] }
  return { header, levels: levels as ProfileLevelInput[], lines: levelLines(text), issues: [] }
}

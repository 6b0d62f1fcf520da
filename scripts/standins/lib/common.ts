// Shared bits of the local stand-ins: where they keep their files, atomic JSON writes and append-only message logs.
import { appendFileSync, existsSync, mkdirSync, readFileSync, renameSync, statSync, writeFileSync } from 'node:fs'
import { join, resolve } from 'node:path'

export const dataDir = () => resolve(process.env.VEERLINE_DATA_DIR || '.data')
export const standinDir = () => {
  const dir = join(dataDir(), 'standins')
  mkdirSync(dir, { recursive: true })
  return dir
}
export const smtpPort = () => Number(process.env.VEERLINE_SMTP_PORT || 2525)
export const pushPort = () => Number(process.env.VEERLINE_PUSH_PORT || 8443)

export function readJson<T>(file: string, fallback: T): T {
  try {
    return JSON.parse(readFileSync(file, 'utf8')) as T
  }
  catch {
    return fallback
  }
}

export function writeJson(file: string, value: unknown) {
  const tmp = `${file}.${process.pid}.tmp`
  writeFileSync(tmp, JSON.stringify(value, null, 1))
  renameSync(tmp, file)
}

/** Appends one message as one line of JSON (JSON Lines): the cost of a message never grows with the file. */
export function appendJsonLine(file: string, value: unknown) {
  appendFileSync(file, `${JSON.stringify(value)}\n`)
}

/** Every line of a JSON Lines file, oldest first (a torn last line after a crash is skipped). */
export function readJsonLines<T>(file: string): T[] {
  if (!existsSync(file)) return []
  const out: T[] = []
  for (const line of readFileSync(file, 'utf8').split('\n')) {
    if (!line) continue
    try {
      out.push(JSON.parse(line) as T)
    }
    catch { /* a line cut short by a crash */ }
  }
  return out
}

/** At start: a log grown past `maxBytes` moves aside to `<file>.1` (one earlier generation is kept). */
export function rotateIfLarge(file: string, maxBytes = 64 * 1024 * 1024) {
  try {
    if (statSync(file).size > maxBytes) renameSync(file, `${file}.1`)
  }
  catch { /* no file yet */ }
}

/** A number kept in a small control file (the tests set the stand-in's per-message delay this way); 0 when absent. */
export function controlNumber(file: string) {
  try {
    const v = Number(readFileSync(file, 'utf8').trim())
    return Number.isFinite(v) && v > 0 ? v : 0
  }
  catch {
    return 0
  }
}

// Shared bits of the local stand-ins: where they keep their files, and atomic JSON writes.
import { mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs'
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

// Helpers for the profile and airfield API tests: unique test airfields and direct row counts.
import mysql from 'mysql2/promise'
import type { ApiClient } from './api'

export function uniqueCode(): string {
  const letters = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ'
  const pick = () => letters[Math.floor(Math.random() * letters.length)]
  return `XT${pick()}${pick()}`
}

/**
 * A test code no airfield has yet (checked in the database): for tests that create an airfield themselves and
 * expect 201. 676 XT codes fill up as the suites add airfields, so a random pick alone collides now and then.
 */
export async function unusedCode(): Promise<string> {
  for (let attempt = 0; attempt < 200; attempt++) {
    const code = uniqueCode()
    const [rows] = await db().query('SELECT 1 FROM airfields WHERE code = ?', [code])
    if ((rows as unknown[]).length === 0) return code
  }
  throw new Error('no free test airfield code')
}

/** A fresh test airfield (unique code) with one runway 18/36 of entered true headings 180/360. */
export async function makeAirfield(client: ApiClient, extra: Record<string, unknown> = {}) {
  for (let attempt = 0; attempt < 20; attempt++) {
    const code = uniqueCode()
    const res = await client.post('/api/airfields', {
      code, name: `Test field ${code}`, latitudeDeg: 46.2, longitudeDeg: 7.3, elevation: 1500, elevationUnit: 'ft', ...extra,
    })
    if (res.status === 409) continue
    if (res.status !== 201) throw new Error(`airfield not created: ${res.status} ${JSON.stringify(res.body)}`)
    const rw = await client.post(`/api/airfields/${code}/runways`, {
      lengthM: 2400, ends: [{ designator: '18', trueHeadingDeg: 180 }, { designator: '36', trueHeadingDeg: 360 }],
    })
    if (rw.status !== 201) throw new Error(`runway not created: ${rw.status} ${JSON.stringify(rw.body)}`)
    return { code, airfield: res.body.airfield }
  }
  throw new Error('no free test airfield code')
}

let pool: mysql.Pool | undefined
function db() {
  pool ??= mysql.createPool({ uri: process.env.DATABASE_URL!, connectionLimit: 2, timezone: 'Z' })
  return pool
}

/** Rows in a table (optionally filtered by a WHERE clause with ? values). */
export async function countRows(table: string, where = '1=1', values: unknown[] = []): Promise<number> {
  const [rows] = await db().query(`SELECT COUNT(*) AS n FROM \`${table}\` WHERE ${where}`, values)
  return Number((rows as { n: number }[])[0]!.n)
}

/** A statement run straight on the database, past every route of the app (for tests of what the app notices). */
export async function runSql(text: string, values: unknown[] = []) {
  await db().query(text, values)
}

export async function closeDb() {
  await pool?.end()
  pool = undefined
}

/** A valid profile body for the next hours (times in whole minutes, UTC). */
export function profileBody(fromOffsetH = 0, hours = 3, extra: Record<string, unknown> = {}) {
  const start = new Date(Math.floor(Date.now() / 60_000) * 60_000 + fromOffsetH * 3600_000)
  return {
    validFrom: start.toISOString(),
    validTo: new Date(start.getTime() + hours * 3600_000).toISOString(),
    source: 'wind-profiler',
    heightReference: 'AGL',
    levels: [
      { heightM: 10, directionDeg: 200, speedKt: 12, gustKt: 22 },
      { heightM: 150, directionDeg: 220, speedKt: 25 },
      { heightM: 300, directionDeg: 240, speedKt: 35 },
      { heightM: 600, directionDeg: 250, speedKt: 40 },
    ],
    ...extra,
  }
}

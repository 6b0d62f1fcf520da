// Helpers for the alert tests: a test airfield made straight in the database (runways with known true headings and
// no magnetic variation), bounded polling, the stand-ins' pid file.
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import mysql from 'mysql2/promise'
import { ApiClient, signedIn } from './api'

export const randomCode = () => `XT${Array.from({ length: 2 }, () => String.fromCharCode(65 + Math.floor(Math.random() * 26))).join('')}`

/** A fresh airfield with runway ends at the given true headings (e.g. { '18': 180, '36': 360 }), variation 0. */
export async function createTestAirfield(ends: Record<string, number>, name = 'Alert test field', databaseUrl = process.env.DATABASE_URL!) {
  const conn = await mysql.createConnection({ uri: databaseUrl, timezone: 'Z' })
  try {
    for (let tries = 0; tries < 20; tries++) {
      const code = randomCode()
      const [found] = await conn.query('SELECT id FROM airfields WHERE code = ?', [code]) as unknown as [unknown[]]
      if (found.length) continue
      const [a] = await conn.query('INSERT INTO airfields (code, name, latitude_deg, longitude_deg, elevation_m, elevation_unit, mag_var_override_deg, mag_var_override_reason) VALUES (?, ?, 45.5, 7.25, 120, \'m\', 0, \'test field: true headings\')', [code, name]) as unknown as [{ insertId: number }]
      const [r] = await conn.query('INSERT INTO runways (airfield_id, length_m) VALUES (?, 2500)', [a.insertId]) as unknown as [{ insertId: number }]
      for (const [designator, heading] of Object.entries(ends)) {
        await conn.query('INSERT INTO runway_ends (runway_id, airfield_id, designator, true_heading_deg, heading_source) VALUES (?, ?, ?, ?, \'entered\')', [r.insertId, a.insertId, designator, heading])
      }
      return code
    }
    throw new Error('no free test airfield code')
  }
  finally {
    await conn.end()
  }
}

/** Polls until `check` returns a truthy value, at most `timeoutMs`; returns that value or throws with `what`. */
export async function waitFor<T>(what: string, check: () => Promise<T | null | undefined | false>, timeoutMs = 30_000, everyMs = 250): Promise<T> {
  const deadline = Date.now() + timeoutMs
  let last: unknown
  while (Date.now() < deadline) {
    try {
      const v = await check()
      if (v) return v
    }
    catch (err) {
      last = err
    }
    await new Promise(r => setTimeout(r, everyMs))
  }
  throw new Error(`timed out waiting for ${what}${last ? ` (last error: ${(last as Error).message})` : ''}`)
}

export const smtpPid = () => Number(readFileSync(join(process.env.VEERLINE_DATA_DIR || '.data', 'standins', 'smtp.pid'), 'utf8'))

/** A new user of the role with a known password, signed in. */
export async function newUser(admin: ApiClient, role: 'pilot' | 'dispatcher' | 'safety' | 'admin', tag: string) {
  const email = `${tag}-${Date.now()}-${Math.floor(Math.random() * 1e6)}@veerline.example`
  const created = await admin.post('/api/users', { email, name: `Probe ${tag}`, role, password: 'correct-horse-battery' })
  if (created.status !== 201) throw new Error(`user not created: ${JSON.stringify(created.body)}`)
  const client = new ApiClient()
  await client.signIn(email, 'correct-horse-battery')
  return { client, email, id: created.body.user.id as number }
}

export function windProfile(dirDeg: number, speedKt: number, hours = 3) {
  const now = Date.now()
  return {
    validFrom: new Date(now - 10 * 60_000).toISOString(),
    validTo: new Date(now + hours * 3600_000).toISOString(),
    source: 'estimate',
    heightReference: 'AGL',
    levels: [
      { heightM: 0, directionDeg: dirDeg, speedKt },
      { heightM: 300, directionDeg: dirDeg, speedKt },
      { heightM: 600, directionDeg: dirDeg, speedKt },
    ],
  }
}

export async function mailTo(admin: ApiClient, email: string) {
  const res = await admin.get(`/api/mailbox?to=${encodeURIComponent(email)}&reveal=1&limit=1000`)
  return res.body.messages as { subject: string, text: string, html: string | null, deliveryId: string | null }[]
}

export { signedIn }

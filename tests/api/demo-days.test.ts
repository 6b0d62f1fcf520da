// The demo stays alive: a start on a later day files that day's demo profiles through the filing path, with their
// alerts, and a second start files nothing twice.
import mysql from 'mysql2/promise'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { signedIn, type ApiClient } from '../support/api'
import { waitFor } from '../support/alerts'
import { startSecondInstance, type SecondInstance } from '../support/instance'

const DEMO_CODES = ['XVAL', 'XCST', 'XHGH']
// The demo scenario files a profile every 3 hours of the UTC day at each demo airfield (server/seed/demo-airfields.ts).
const SLOTS_PER_DAY = 8

let db: mysql.Connection
let dispatcher: ApiClient
let second: SecondInstance | null = null
beforeAll(async () => {
  db = await mysql.createConnection({ uri: process.env.DATABASE_URL!, timezone: 'Z' })
  dispatcher = await signedIn('dispatcher')
})
afterAll(async () => {
  await second?.stop()
  await db?.end()
})

async function profilesOn(day: string) {
  const [rows] = await db.query(`SELECT p.id, a.code, p.valid_from AS validFrom, p.status, p.entry FROM profiles p JOIN airfields a ON a.id = p.airfield_id
    WHERE a.code IN (?) AND p.valid_from >= ? AND p.valid_from < ? + INTERVAL 1 DAY ORDER BY a.code, p.valid_from`, [DEMO_CODES, `${day} 00:00:00`, `${day} 00:00:00`])
  return rows as { id: number, code: string, validFrom: Date, status: string, entry: unknown }[]
}

async function startOn(day: string) {
  const instance = await startSecondInstance('dispatch@veerline.example', { VEERLINE_DEMO_DATE: day })
  const line = await waitFor(`the demo day line for ${day}`, async () => instance.output().match(new RegExp(`demo day ${day}: filed (\\d+), already there (\\d+), refused (\\d+)(.*)`)), 60_000)
  return { instance, filed: Number(line[1]), present: Number(line[2]), refused: Number(line[3]), detail: line[4] }
}

describe('demo days', () => {
  it('a start on a later day files that day\'s demo profiles with their alerts; a second start files nothing twice', async () => {
    // Two days after today (UTC): later than the seeded day whatever the hour.
    const later = new Date(Date.now() + 2 * 86_400_000).toISOString().slice(0, 10)
    expect(await profilesOn(later)).toHaveLength(0)

    const first = await startOn(later)
    second = first.instance
    expect(first.refused, first.detail).toBe(0)
    expect(first.filed).toBe(DEMO_CODES.length * SLOTS_PER_DAY)
    const filed = await profilesOn(later)
    expect(filed).toHaveLength(DEMO_CODES.length * SLOTS_PER_DAY)
    for (const code of DEMO_CODES) {
      // 00Z, 03Z, ... 21Z of that day (every 3 hours, as the scenario says).
      expect(filed.filter(p => p.code === code).map(p => p.validFrom.toISOString().slice(11, 13))).toEqual(['00', '03', '06', '09', '12', '15', '18', '21'])
    }
    // Filed as a feed files: the filing path's audit entry for every profile, one alert evaluation each.
    const ids = filed.map(p => p.id)
    const [audits] = await db.query(`SELECT COUNT(*) AS n FROM audit_log WHERE action = 'profile.file' AND entity_type = 'profile' AND entity_id IN (?)
      AND JSON_EXTRACT(details, '$.demoDay') = ?`, [ids.map(String), later])
    expect(Number((audits as { n: number }[])[0]!.n)).toBe(ids.length)
    // With their alerts: the valley jet overnight crosses the default limits on purpose (demo scenario notes).
    const [alerts] = await db.query('SELECT COUNT(*) AS n FROM alerts WHERE profile_id IN (?)', [ids])
    expect(Number((alerts as { n: number }[])[0]!.n)).toBeGreaterThan(0)
    // The API shows them as the airfield's profiles.
    const listed = await dispatcher.get(`/api/airfields/XVAL/profiles?from=${later}T00:00:00Z&to=${later}T23:59:59Z&status=active&pageSize=50`)
    expect(listed.status).toBe(200)
    expect(listed.body.profiles.map((p: { id: number }) => p.id)).toEqual(expect.arrayContaining(filed.filter(p => p.code === 'XVAL').map(p => p.id)))
    await second.stop()
    second = null

    const again = await startOn(later)
    second = again.instance
    expect(again.filed).toBe(0)
    expect(again.present).toBe(DEMO_CODES.length * SLOTS_PER_DAY)
    expect((await profilesOn(later)).map(p => p.id)).toEqual(ids)
    const [alertsAfter] = await db.query('SELECT COUNT(*) AS n FROM alerts WHERE profile_id IN (?)', [ids])
    expect(Number((alertsAfter as { n: number }[])[0]!.n)).toBe(Number((alerts as { n: number }[])[0]!.n))
    await second.stop()
    second = null

    // Leave the shared demo as it was for the suites after this one: withdraw what this test filed.
    for (const id of ids) {
      const res = await dispatcher.post(`/api/profiles/${id}/withdraw`, { reason: 'Demo day test: filed for a later day' })
      expect(res.status, String(id)).toBe(200)
    }
  }, 180_000) // a hang guard for a loaded machine, not a speed check

  it('a malformed VEERLINE_DEMO_DATE is reported and files nothing', async () => {
    const before = await db.query('SELECT COUNT(*) AS n FROM profiles')
    second = await startSecondInstance('dispatch@veerline.example', { VEERLINE_DEMO_DATE: '2026-02-30' })
    await waitFor('the refusal of the setting', async () => second!.output().includes('VEERLINE_DEMO_DATE must be a date written YYYY-MM-DD'), 60_000)
    const after = await db.query('SELECT COUNT(*) AS n FROM profiles')
    expect((after[0] as { n: number }[])[0]!.n).toBe((before[0] as { n: number }[])[0]!.n)
    await second.stop()
    second = null
  }, 120_000)
})

// Pieces shared by the delivery fault tests (tests/api/outbox.test.ts) and the fan-out benchmark (bench/fanout.ts):
// app instances started on a database of their own, many recipients made straight in the database, and what the
// stand-ins received, counted per delivery id. Instances are started with tests/support/instance.ts.
import { readFileSync, writeFileSync, rmSync } from 'node:fs'
import { join } from 'node:path'
import mysql from 'mysql2/promise'

export const standinDir = () => join(process.env.VEERLINE_DATA_DIR || '.data', 'standins')
export const pushStandin = () => `http://127.0.0.1:${process.env.VEERLINE_PUSH_PORT || 8443}`

/** Sets (or, with 0, clears) the SMTP stand-in's delay before it accepts each message. */
export function setSmtpDelay(ms: number) {
  setDelay('smtp-delay-ms', ms)
}
/** Sets (or, with 0, clears) the push stand-in's delay before it answers each push. */
export function setPushDelay(ms: number) {
  setDelay('push-delay-ms', ms)
}
function setDelay(name: string, ms: number) {
  const file = join(standinDir(), name)
  if (ms > 0) writeFileSync(file, String(ms))
  else rmSync(file, { force: true })
}

export const smtpPid = () => Number(readFileSync(join(standinDir(), 'smtp.pid'), 'utf8'))

/**
 * `emails` users following the airfield by e-mail, the first `pushes` of them also with one simulated device each
 * (issued by the push stand-in), all written straight into the database. Returns the addresses and device ids.
 */
export async function makeRecipients(databaseUrl: string, airfieldCode: string, tag: string, emails: number, pushes = 0) {
  const conn = await mysql.createConnection({ uri: databaseUrl, timezone: 'Z' })
  try {
    const [[field]] = await conn.query('SELECT id FROM airfields WHERE code = ?', [airfieldCode]) as unknown as [{ id: number }[]]
    if (!field) throw new Error(`no airfield ${airfieldCode}`)
    const addresses = Array.from({ length: emails }, (_, i) => `${tag}-${i}@fanout.veerline.example`)
    for (let i = 0; i < addresses.length; i += 250) {
      const chunk = addresses.slice(i, i + 250)
      await conn.query('INSERT INTO users (email, name, role) VALUES ?', [chunk.map((e, j) => [e, `Fan-out crew ${i + j}`, 'pilot'])])
    }
    const [users] = await conn.query('SELECT id, email FROM users WHERE email LIKE ? ORDER BY id', [`${tag}-%@fanout.veerline.example`]) as unknown as [{ id: number, email: string }[]]
    const byEmail = new Map(users.map(u => [u.email, u.id]))
    const ids = addresses.map(a => byEmail.get(a)!)
    await conn.query('INSERT INTO alert_subscriptions (user_id, airfield_id, email, push) VALUES ?', [ids.map((id, i) => [id, field.id, 1, i < pushes ? 1 : 0])])
    const devices: string[] = []
    const rows: unknown[][] = []
    for (let i = 0; i < pushes; i++) {
      const res = await fetch(`${pushStandin()}/subscriptions`, { method: 'POST', body: JSON.stringify({ label: `${tag} device ${i}` }), headers: { 'content-type': 'application/json' } })
      const sub = await res.json() as { id: string, endpoint: string, keys: { p256dh: string, auth: string } }
      devices.push(sub.id)
      rows.push([ids[i], sub.endpoint, sub.keys.p256dh, sub.keys.auth, `${tag} device ${i}`])
    }
    if (rows.length) await conn.query('INSERT INTO push_subscriptions (user_id, endpoint, p256dh, auth, label) VALUES ?', [rows])
    return { addresses, devices, userIds: ids }
  }
  finally {
    await conn.end()
  }
}

/** How many e-mails the SMTP stand-in holds per delivery id, among those sent to `addresses`. */
export function mailCounts(addresses: string[]) {
  const wanted = new Set(addresses.map(a => a.toLowerCase()))
  const counts = new Map<string, number>()
  let text = ''
  try {
    text = readFileSync(join(standinDir(), 'mailbox.jsonl'), 'utf8')
  }
  catch { /* nothing received yet */ }
  for (const line of text.split('\n')) {
    if (!line) continue
    let m: { envelopeTo: string[], deliveryId: string | null }
    try {
      m = JSON.parse(line)
    }
    catch {
      continue
    }
    if (!m.envelopeTo.some(t => wanted.has(t.toLowerCase())) || !m.deliveryId) continue
    counts.set(m.deliveryId, (counts.get(m.deliveryId) ?? 0) + 1)
  }
  return counts
}

/** How many pushes the push stand-in decrypted per delivery id, among those for `devices`. */
export async function pushCounts(devices: string[]) {
  const counts = new Map<string, number>()
  if (!devices.length) return counts
  for (let i = 0; i < devices.length; i += 100) {
    const res = await fetch(`${pushStandin()}/messages?subscription=${devices.slice(i, i + 100).join(',')}&pageSize=1000`)
    const body = await res.json() as { messages: { payload: { deliveryId?: string } }[] }
    for (const m of body.messages) {
      const id = m.payload?.deliveryId
      if (id) counts.set(id, (counts.get(id) ?? 0) + 1)
    }
  }
  return counts
}

/** Polls until `check` returns a truthy value, at most `timeoutMs`. */
export async function until<T>(what: string, check: () => Promise<T | null | undefined | false>, timeoutMs = 30_000, everyMs = 100): Promise<T> {
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

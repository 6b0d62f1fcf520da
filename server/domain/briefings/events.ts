/**
 * The live briefing: a change stamp per airfield read from the database (so a profile filed through any app
 * instance is seen by every other), polled by each open event stream, and the reader's unacknowledged alert count.
 * No in-memory bus: the stamp is computed from the rows themselves, nothing has to be written for it.
 */
import type { H3Event } from 'h3'
import { createEventStream } from 'h3'
import { usePool } from '../../utils/db'
import { STAMP_ONE_SQL } from './read'
import { changeKinds } from '../../../shared/briefing/live'

/** How often an open stream reads the stamp (VEERLINE_EVENTS_POLL_MS), and when it ends so the browser reconnects
 * and the session is checked again (VEERLINE_EVENTS_MAX_S). */
export const EVENTS_POLL_MS = Number(process.env.VEERLINE_EVENTS_POLL_MS) || 1000
export const EVENTS_MAX_MS = (Number(process.env.VEERLINE_EVENTS_MAX_S) || 120) * 1000
/** The browser waits this long before reconnecting (the `retry` field of the stream). */
export const EVENTS_RETRY_MS = 2000
const PING_EVERY = 15

// Profiles: how many, the newest, how many withdrawn and superseded, the latest of those changes. Limits, runway
// ends and the airfield's own row: the briefing's input digest (read.ts). The reader's open alerts on the side.
const STAMP_SQL = `SELECT a.id AS airfield_id,
  (SELECT CONCAT_WS(',', COUNT(*), IFNULL(MAX(q.id), 0), SUM(q.status = 'withdrawn'), SUM(q.status = 'superseded'),
     IFNULL(UNIX_TIMESTAMP(MAX(q.withdrawn_at)), 0), IFNULL(UNIX_TIMESTAMP(MAX(q.superseded_at)), 0))
   FROM profiles q WHERE q.airfield_id = a.id) AS profiles_sig,
  ${STAMP_ONE_SQL} AS inputs_sig,
  (SELECT COUNT(*) FROM alert_inbox i WHERE i.user_id = ? AND i.acknowledged_at IS NULL) AS alerts
  FROM airfields a WHERE a.code = ?`

export type AirfieldStamp = { airfieldId: number, profiles: string, inputs: string, alerts: number }

/** The stamp of one airfield for one reader, or null when there is no such airfield. One query. */
export async function readAirfieldStamp(code: string, userId: number): Promise<AirfieldStamp | null> {
  const [rows] = await usePool().query(STAMP_SQL, [userId, code.toUpperCase()]) as [Record<string, unknown>[], unknown]
  const r = rows[0]
  if (!r) return null
  return { airfieldId: Number(r.airfield_id), profiles: String(r.profiles_sig), inputs: String(r.inputs_sig), alerts: Number(r.alerts) }
}

export const stampId = (s: AirfieldStamp) => `${s.profiles}/${s.inputs}`

/**
 * Streams `text/event-stream` to the reader: `hello` at once (with `change` too when the browser's Last-Event-ID is
 * an older stamp, i.e. it missed one while reconnecting), then `change` whenever the stamp moves, `alerts` when the
 * reader's open alert count moves, and `ping` every 15 polls. Ends after EVENTS_MAX_MS; the browser reconnects.
 */
export function streamAirfieldEvents(event: H3Event, code: string, userId: number, first: AirfieldStamp, lastEventId: string | null) {
  const stream = createEventStream(event)
  let last = first
  let busy = false
  let polls = 0
  const data = (s: AirfieldStamp, extra: Record<string, unknown> = {}) => JSON.stringify({ code, alerts: s.alerts, at: new Date().toISOString(), ...extra })
  const hello: Parameters<typeof stream.push>[0] = [{ id: stampId(first), event: 'hello', retry: EVENTS_RETRY_MS, data: data(first) }]
  if (lastEventId && lastEventId !== stampId(first)) {
    hello.push({ id: stampId(first), event: 'change', data: data(first, { kinds: changeKinds(lastEventId, stampId(first)) }) })
  }
  void stream.push(hello)
  const timer = setInterval(async () => {
    if (busy) return
    busy = true
    try {
      const now = await readAirfieldStamp(code, userId)
      if (!now) return void stream.close()
      polls++
      if (stampId(now) !== stampId(last)) {
        await stream.push({ id: stampId(now), event: 'change', data: data(now, { kinds: changeKinds(stampId(last), stampId(now)) }) })
      }
      if (now.alerts !== last.alerts) await stream.push({ event: 'alerts', data: data(now) })
      else if (polls % PING_EVERY === 0) await stream.push({ event: 'ping', data: data(now) })
      last = now
    }
    catch {
      // The database is away for a moment: the next poll tries again; the browser keeps the stream.
    }
    finally {
      busy = false
    }
  }, EVENTS_POLL_MS)
  const end = setTimeout(() => void stream.close(), EVENTS_MAX_MS)
  stream.onClosed(() => {
    clearInterval(timer)
    clearTimeout(end)
  })
  return stream.send()
}

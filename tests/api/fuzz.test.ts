// Property-based HTTP fuzzing (issue "Safe to deploy", point 8) with fast-check: generated requests to the wind
// preview, filing, import, coded reports, airfields, runways and list queries. Two properties hold for every one:
// no answer is a 5xx (RFC 9110 §15.6: server errors are for faults, never for what a client sent), and a refused
// write (4xx) saved nothing (the row counts of the tables it would write are unchanged).
// The seed is fixed (VEERLINE_FUZZ_SEED overrides it, e.g. to rerun a seed printed by another run); the count of
// requests and of 5xx answers is printed at the end.
import fc from 'fast-check'
import mysql from 'mysql2/promise'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { ApiClient } from '../support/api'
import { signedIn } from '../support/api'
import { createTestAirfield } from '../support/alerts'

const SEED = Number(process.env.VEERLINE_FUZZ_SEED ?? 20261202)
const RUNS = Number(process.env.VEERLINE_FUZZ_RUNS ?? 300)

let dispatcher: ApiClient
let admin: ApiClient
let db: mysql.Connection
let code: string
let runwayId: number
let profileId: number
const tally = { requests: 0, serverErrors: 0, refusedWrites: 0, byStatus: {} as Record<number, number> }
const failures: string[] = []

beforeAll(async () => {
  dispatcher = await signedIn('dispatcher')
  admin = await signedIn('admin')
  db = await mysql.createConnection({ uri: process.env.DATABASE_URL!, timezone: 'Z' })
  code = await createTestAirfield({ '09': 90, '27': 270 }, 'Fuzz field')
  const [[rw]] = await db.query('SELECT r.id FROM runways r JOIN airfields a ON a.id = r.airfield_id WHERE a.code = ?', [code]) as unknown as [{ id: number }[]]
  runwayId = rw!.id
  const filed = await dispatcher.post(`/api/airfields/${code}/profiles`, {
    validFrom: '2026-03-01T06:00:00Z', validTo: '2026-03-01T09:00:00Z', source: 'estimate', heightReference: 'AGL',
    levels: [{ heightM: 0, directionDeg: 90, speedKt: 5 }, { heightM: 300, directionDeg: 100, speedKt: 10 }],
  })
  expect(filed.status).toBe(201)
  profileId = filed.body.profile.id
  console.log(`[fuzz] seed ${SEED} (rerun with VEERLINE_FUZZ_SEED=${SEED}), ${RUNS} runs per property`)
})
afterAll(async () => {
  await db?.end()
  console.log(`[fuzz] ${tally.requests} requests, ${tally.serverErrors} answers of 5xx, ${tally.refusedWrites} refused writes checked for partial saves; statuses ${JSON.stringify(tally.byStatus)}`)
})

/** Row counts of everything a write could touch. */
async function footprint() {
  const [rows] = await db.query(`SELECT (SELECT COUNT(*) FROM profiles) AS profiles, (SELECT COUNT(*) FROM profile_levels) AS levels,
    (SELECT COUNT(*) FROM airfields) AS airfields, (SELECT COUNT(*) FROM runways) AS runways, (SELECT COUNT(*) FROM runway_ends) AS ends,
    (SELECT COUNT(*) FROM audit_log) AS audit, (SELECT COUNT(*) FROM idempotency_keys) AS idem`) as unknown as [Record<string, number>[]]
  return JSON.stringify(rows[0])
}

type Req = { method: string, path: string, body?: unknown, headers?: Record<string, string>, write?: boolean }

async function send(client: ApiClient, req: Req) {
  const before = req.write ? await footprint() : ''
  const res = await client.request(req.method, req.path, req.body, req.headers)
  tally.requests++
  tally.byStatus[res.status] = (tally.byStatus[res.status] ?? 0) + 1
  const where = `${req.method} ${req.path.slice(0, 160)} body ${JSON.stringify(req.body)?.slice(0, 200)}`
  if (res.status >= 500) {
    tally.serverErrors++
    failures.push(`${res.status} for ${where}: ${JSON.stringify(res.body).slice(0, 200)}`)
  }
  if (req.write && res.status >= 400) {
    tally.refusedWrites++
    const after = await footprint()
    if (after !== before) failures.push(`refused ${res.status} but saved something: ${where} (${before} -> ${after})`)
  }
  return res
}

// Building blocks: values a person or a broken system might send.
const weirdNumber = fc.oneof(
  fc.double({ noNaN: false }), fc.integer(), fc.constantFrom(0, -0, 1e300, -1e300, 999, 250, 250.0001, 360, 361, -1, 1e-320),
  fc.constantFrom('12', '', ' ', 'NaN', '1e3', '0x1b', null, true, [], {}),
)
const isoLike = fc.oneof(
  fc.date({ min: new Date('1900-01-01T00:00:00Z'), max: new Date('2200-01-01T00:00:00Z'), noInvalidDate: true }).map(d => d.toISOString()),
  fc.constantFrom('2026-03-01T06:00:00+99:99', '2026-03-01T06:00:00+2400', '2026-03-01T06:00:00+24:00', '10000-01-01T00:00:00Z',
    '0000-01-01T00:00:00Z', '9999-12-31T23:59:59Z', '2026-02-30T00:00:00Z', '2026-13-01T00:00:00Z', '2026-03-01T25:00:00Z',
    '2026-03-01', '1969-12-31T23:59:59Z', '2100-12-31T23:00:00Z', '2026-03-01T06:00:00.123456789Z', '+002026-03-01T00:00:00Z', ''),
  fc.string({ maxLength: 30 }),
)
const level = fc.record({
  heightM: weirdNumber, heightFt: weirdNumber, pressureHpa: weirdNumber, directionDeg: weirdNumber,
  speedKt: weirdNumber, speedMps: weirdNumber, gustKt: weirdNumber, extra: fc.string({ maxLength: 5 }),
}, { requiredKeys: [] })
const goodLevel = fc.record({
  heightM: fc.integer({ min: 0, max: 600 }), directionDeg: fc.integer({ min: 0, max: 360 }), speedKt: fc.integer({ min: 0, max: 250 }),
})
const profileBody = fc.record({
  validFrom: isoLike, validTo: isoLike,
  source: fc.constantFrom('estimate', 'radiosonde', 'bogus', '', '__proto__'),
  heightReference: fc.constantFrom('AGL', 'MSL', 'agl', 'XYZ'),
  notes: fc.oneof(fc.string({ maxLength: 40 }), fc.string({ minLength: 1990, maxLength: 2100 })),
  levels: fc.oneof(fc.array(fc.oneof(level, goodLevel), { maxLength: 6 }), weirdNumber),
}, { requiredKeys: [] })
const anyJson = fc.oneof(profileBody, fc.jsonValue({ maxDepth: 4 }))
const header = fc.constantFrom('heightM', 'heightFt', 'directionDeg', 'speedKt', 'speedMps', 'gustKt', 'pressureHpa', '__proto__', 'constructor', 'prototype', 'toString', '', 'heightm')
const cell = fc.oneof(fc.integer({ min: -100, max: 1000 }).map(String), fc.constantFrom('', '1e300', 'NaN', '"', '"a,b"', '-', '0x10', '999'), fc.string({ maxLength: 6 }))
const csvText = fc.tuple(fc.array(header, { minLength: 1, maxLength: 5 }), fc.array(fc.array(cell, { maxLength: 6 }), { maxLength: 6 }), fc.constantFrom(',', ';', '\t'), fc.boolean())
  .map(([h, rows, sep, bom]) => `${bom ? '\uFEFF' : ''}${[h.join(sep), ...rows.map(r => r.join(sep))].join('\n')}`)
const codedLine = fc.oneof(
  fc.tuple(fc.integer({ min: 0, max: 999 }), fc.integer({ min: 0, max: 999 }), fc.integer({ min: 0, max: 9999 }), fc.constantFrom('KT', 'MPS', 'KMH', 'XX'))
    .map(([h, d, s, u]) => `TAF ${'X'}FZZ 011100Z 0112/0218 22010KT 9999 WS${String(h).padStart(3, '0')}/${String(d).padStart(3, '0')}${String(s).padStart(2, '0')}${u}`),
  fc.tuple(fc.integer({ min: 0, max: 999 }), fc.integer({ min: 0, max: 999 }), fc.option(fc.integer({ min: 0, max: 999 })), fc.constantFrom('KT', 'MPS'))
    .map(([d, s, g, u]) => `METAR XFZZ 011200Z ${String(d).padStart(3, '0')}${String(s).padStart(2, '0')}${g === null ? '' : `G${String(g).padStart(2, '0')}`}${u} 9999`),
  fc.constantFrom('WS999/360999KT', 'METAR XFZZ 011200Z 00000G15KT', 'VRB99KT', 'P99KT', '360P99KT', 'METAR', ''),
  fc.string({ maxLength: 60 }),
)
const queryValue = fc.oneof(fc.constantFrom('1e300', '-1', '0', '0x1b', '1.5', ' 2', '2 ', '00027', '+3', '9007199254740993', '1e3', '', 'abc', '%00', '27abc'),
  fc.integer().map(String), isoLike)
const enc = encodeURIComponent

describe('HTTP fuzzing: no 5xx, nothing half-saved', () => {
  const property = (name: string, arb: fc.Arbitrary<Req>, client = () => dispatcher) => it(name, async () => {
    await fc.assert(fc.asyncProperty(arb, async (req) => {
      await send(client(), req)
    }), { seed: SEED, numRuns: RUNS, endOnFailure: true })
    expect(failures, failures.slice(0, 5).join('\n')).toEqual([])
  }, 600_000)

  property('wind preview', anyJson.map(body => ({ method: 'POST', path: '/api/wind/preview', body })))

  property('filing', fc.tuple(anyJson, fc.option(fc.string({ minLength: 1, maxLength: 220 }))).map(([body, key]): Req => ({
    method: 'POST', path: `/api/airfields/${code}/profiles`, body, write: true, headers: key === null ? {} : { 'idempotency-key': key },
  })))

  property('import (CSV and JSON, preview and file)', fc.tuple(fc.oneof(csvText, anyJson.map(j => JSON.stringify(j))), fc.constantFrom('csv', 'json', 'xml'),
    fc.constantFrom('preview', 'file', 'bogus'), isoLike, isoLike).map(([text, format, mode, from, to]) => ({
    method: 'POST', write: true, body: text,
    path: `/api/airfields/${code}/profiles/import?format=${format}&mode=${mode}&validFrom=${enc(from)}&validTo=${enc(to)}&source=estimate&heightReference=AGL`,
    headers: { 'content-type': text.trimStart().replace(/^\uFEFF/, '').startsWith('{') ? 'application/json' : 'text/csv' },
  })))

  property('coded reports', fc.oneof(fc.array(codedLine, { minLength: 1, maxLength: 4 }).map(l => ({ text: l.join('\n') })), fc.jsonValue({ maxDepth: 2 }))
    .map(body => ({ method: 'POST', path: '/api/wind/coded', body })))

  property('airfields (create and change)', fc.tuple(fc.record({
    code: fc.oneof(fc.constantFrom('XFZA', 'xfzb', 'XVAL', '', 'ABCDE', '12AB'), fc.string({ maxLength: 6 })),
    name: fc.oneof(fc.string({ maxLength: 10 }), fc.string({ minLength: 119, maxLength: 130 })),
    latitudeDeg: weirdNumber, longitudeDeg: weirdNumber, elevation: weirdNumber, elevationUnit: fc.constantFrom('ft', 'm', 'km'),
    magVarOverrideDeg: weirdNumber, magVarOverrideReason: fc.string({ maxLength: 300 }), notes: fc.string({ maxLength: 20 }),
  }, { requiredKeys: [] }), fc.boolean()).map(([body, create]) => create
    ? { method: 'POST', path: '/api/airfields', body, write: true }
    : { method: 'PATCH', path: `/api/airfields/${code}`, body: { ...body, code: undefined }, write: true }))

  property('runways (add and change)', fc.tuple(fc.record({
    lengthM: weirdNumber,
    ends: fc.oneof(fc.array(fc.record({
      designator: fc.oneof(fc.constantFrom('09', '27', '36', '18', '00', '37', '09L', '27R', '9'), fc.string({ maxLength: 4 })),
      thresholdLatDeg: weirdNumber, thresholdLonDeg: weirdNumber, thresholdElevationM: weirdNumber, trueHeadingDeg: weirdNumber,
    }, { requiredKeys: [] }), { maxLength: 3 }), weirdNumber),
  }, { requiredKeys: [] }), fc.boolean(), queryValue, fc.boolean()).map(([body, add, id, real]) => add
    ? { method: 'POST', path: `/api/airfields/${code}/runways`, body, write: true }
    : { method: 'PATCH', path: `/api/airfields/${code}/runways/${real ? runwayId : enc(id)}`, body, write: true }))

  property('list queries and ids', fc.tuple(fc.constantFrom('profiles', 'alerts', 'audit', 'trend', 'profile', 'deliveries', 'briefing'),
    queryValue, queryValue, queryValue, fc.constantFrom('validFrom', 'source', 'nope', '__proto__'), fc.constantFrom('asc', 'desc', 'up'), fc.boolean())
    .map(([what, a, b, c, sort, order, real]) => {
      const q = `page=${enc(a)}&pageSize=${enc(b)}&from=${enc(c)}&to=${enc(a)}&sort=${enc(sort)}&order=${enc(order)}`
      const paths: Record<string, string> = {
        profiles: `/api/airfields/${code}/profiles?${q}`,
        alerts: `/api/alerts?airfield=${enc(c)}&state=${enc(b)}&limit=${enc(a)}`,
        audit: `/api/audit?${q}`,
        trend: `/api/airfields/${code}/trend?date=${enc(c)}`,
        profile: `/api/profiles/${real ? profileId : enc(a)}`,
        deliveries: `/api/alerts/deliveries?state=${enc(b)}&limit=${enc(a)}`,
        briefing: `/api/airfields/${code}/briefing?profile=${enc(a)}&at=${enc(c)}`,
      }
      return { method: 'GET', path: paths[what]! }
    }), () => admin)

  it('sent at least 2,000 generated requests, none answered 5xx', () => {
    expect(tally.requests).toBeGreaterThanOrEqual(Math.min(2000, RUNS * 7))
    expect(tally.serverErrors).toBe(0)
  })
})

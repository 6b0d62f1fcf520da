/**
 * The demo scenario grown to the size of a real operation, for the HTTP benchmark only (never for `npm start`):
 * invented airfields with X-prefixed codes (XA.. to XH..) and invented names, 2 to 4 runways each, a day of
 * profiles each (every 3 hours of the current UTC day, 20 levels from 10 m to 2 km), a few airfields whose profiles
 * have 5,000 levels, and 1,000 invented users on the reserved example domain. Nothing here is a real place or person.
 * `growTo(db, n)` adds bench airfields until there are `n` of them; it can be called again with a larger `n`.
 */
import type { MySql2Database } from 'drizzle-orm/mysql2'
import { count, like } from 'drizzle-orm'
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import * as schema from '../../server/db/schema'

type DB = MySql2Database<typeof schema>

/** Bench airfields whose every profile has 5,000 levels (the most a profile may have). */
export const DEEP_INDEXES = new Set([0, 100, 150])
export const DEEP_LEVELS = 5000
export const SHALLOW_LEVELS = 20
export const USERS = 1000

const LETTERS = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ'
/** Index 0 → XAAA, 1 → XAAB, ... (four letters, X first, as the airfield code rule asks). */
export function benchCode(i: number) {
  return `X${LETTERS[Math.floor(i / 676) % 26]}${LETTERS[Math.floor(i / 26) % 26]}${LETTERS[i % 26]}`
}

// Invented syllables; the names they make are nonsense words, checked against no list of real places.
const HEADS = ['Vel', 'Quor', 'Zan', 'Thal', 'Morv', 'Ulth', 'Ysk', 'Karr', 'Oph', 'Drel', 'Fenq', 'Hyr', 'Jasp', 'Nurv']
const MIDS = ['en', 'ar', 'ith', 'ol', 'ux', 'ev', 'ay']
const TAILS = ['mere', 'dale', 'holt', 'fell', 'wyn', 'sk', 'rith', 'vane']
function benchName(i: number) {
  return `${HEADS[i % HEADS.length]}${MIDS[Math.floor(i / HEADS.length) % MIDS.length]}${TAILS[Math.floor(i / (HEADS.length * MIDS.length)) % TAILS.length]} (bench)`
}

// A small deterministic generator, so every run seeds the same scenario.
function rng(seed: number) {
  let s = seed >>> 0
  return () => {
    s = (s * 1664525 + 1013904223) >>> 0
    return s / 2 ** 32
  }
}

function dayStart(now = new Date()) {
  return new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate()))
}

/** Levels from 10 m up: a jet near 300 m that veers with height; `n` levels spread to 2 km (or 10 km when deep). */
function levels(n: number, hourZ: number, r: () => number) {
  const topM = n > 100 ? 10_000 : 2000
  const baseDir = 150 + 120 * r()
  const jetKt = 10 + 30 * r() * (hourZ <= 6 || hourZ >= 21 ? 1 : 0.4)
  return Array.from({ length: n }, (_, i) => {
    const heightM = 10 + (i * (topM - 10)) / (n - 1)
    const dir = (baseDir + 60 * Math.min(1, heightM / 3000) + 2 * Math.sin(i)) % 360
    return {
      heightM: Math.round(heightM * 10) / 10,
      directionDeg: Math.round(dir) || 360,
      speedKt: Math.round(6 + jetKt * Math.exp(-(((heightM - 300) / 180) ** 2)) + heightM / 250),
      ...(i === 0 && r() < 0.3 ? { gustKt: 25 } : {}),
    }
  })
}

async function seedUsers(db: DB) {
  const [{ n }] = await db.select({ n: count() }).from(schema.users).where(like(schema.users.email, 'bench-%')) as [{ n: number }]
  if (n >= USERS) return
  // One scrypt hash for all: hashing a thousand passwords would take a minute and measure nothing.
  const passwordHash = await new Hash(new Scrypt({})).make('veerline-bench')
  const roles = ['pilot', 'pilot', 'pilot', 'dispatcher', 'safety'] as const
  const rows = Array.from({ length: USERS - n }, (_, k) => {
    const i = n + k
    return { email: `bench-${String(i).padStart(4, '0')}@veerline.example`, name: `Bench User ${i}`, role: roles[i % roles.length]!, passwordHash }
  })
  for (let i = 0; i < rows.length; i += 500) await db.insert(schema.users).values(rows.slice(i, i + 500))
}

async function seedAirfield(db: DB, i: number) {
  const r = rng(i + 1)
  const code = benchCode(i)
  const [{ id: airfieldId }] = await db.insert(schema.airfields).values({
    code, name: benchName(i), latitudeDeg: Math.round((-55 + 110 * r()) * 1e4) / 1e4,
    longitudeDeg: Math.round((-170 + 340 * r()) * 1e4) / 1e4, elevationM: Math.round(2000 * r() ** 3),
    elevationUnit: 'ft', notes: 'Bench airfield (invented).',
  }).$returningId() as [{ id: number }]
  const runwayCount = 2 + (i % 3)
  const baseHeading = 10 + Math.floor(r() * 35)
  for (let k = 0; k < runwayCount; k++) {
    // Runways 45° apart, so that the designators of one airfield never repeat.
    const trueHeadingDeg = baseHeading + 45 * k
    const n1 = Math.round(trueHeadingDeg / 10) || 36
    const n2 = n1 + 18 > 36 ? n1 - 18 : n1 + 18
    const [{ id: runwayId }] = await db.insert(schema.runways).values({ airfieldId, lengthM: 1800 + Math.round(1800 * r()) }).$returningId() as [{ id: number }]
    await db.insert(schema.runwayEnds).values([
      { runwayId, airfieldId, designator: String(n1).padStart(2, '0'), trueHeadingDeg, headingSource: 'entered' },
      { runwayId, airfieldId, designator: String(n2).padStart(2, '0'), trueHeadingDeg: (trueHeadingDeg + 180) % 360, headingSource: 'entered' },
    ])
  }
  const start = dayStart()
  const n = DEEP_INDEXES.has(i) ? DEEP_LEVELS : SHALLOW_LEVELS
  for (let hourZ = 0; hourZ < 24; hourZ += 3) {
    const validFrom = new Date(start.getTime() + hourZ * 3600_000)
    const [{ id: profileId }] = await db.insert(schema.profiles).values({
      airfieldId, validFrom, validTo: new Date(validFrom.getTime() + 3 * 3600_000),
      source: n > 100 ? 'radiosonde' : 'wind-profiler', heightReference: 'AGL', entry: { height: 'm', speed: 'kt', method: 'bench' },
      createdAt: new Date(validFrom.getTime() - 20 * 60_000),
    }).$returningId() as [{ id: number }]
    const rows = levels(n, hourZ, r).map((l, seq) => ({ profileId, seq, ...l }))
    for (let j = 0; j < rows.length; j += 1000) await db.insert(schema.profileLevels).values(rows.slice(j, j + 1000))
  }
}

/** Adds bench airfields (and, the first time, the users) until there are `total` bench airfields. */
export async function growTo(db: DB, total: number) {
  await seedUsers(db)
  const [{ n }] = await db.select({ n: count() }).from(schema.airfields).where(like(schema.airfields.notes, 'Bench airfield%')) as [{ n: number }]
  for (let i = n; i < total; i++) {
    await db.transaction(async tx => seedAirfield(tx as unknown as DB, i))
  }
}

/**
 * The demo scenario: three invented airfields in different settings, each with runways and a day of wind profiles
 * (every 3 hours of the current UTC day). Some profiles cross the default limits on purpose. Demo only: the places,
 * names and winds are made up.
 */
import geodesic from 'geographiclib-geodesic'
import { eq } from 'drizzle-orm'
import * as schema from '../db/schema'
import { runwayTrueBearingDeg } from '../../shared/wind'
import type { LevelInput } from '../../shared/wind'
import type { SeedDB } from './index'

type Level = LevelInput
type Slot = { hourZ: number, source: schema.ProfileSource, levels: Level[], notes?: string, entry: { height: string, speed: string } }
type RunwaySpec = { midLatDeg: number, midLonDeg: number, trueBearingDeg: number, lengthM: number, ends: [string, string], elevationsM: [number, number] }
type AirfieldSpec = {
  code: string
  name: string
  latitudeDeg: number
  longitudeDeg: number
  elevationM: number
  elevationUnit: 'ft' | 'm'
  notes: string
  runways: RunwaySpec[]
  heightReference: 'AGL' | 'MSL'
  slots: Slot[]
}

const HOURS = [0, 3, 6, 9, 12, 15, 18, 21]

// Valley field: calm nights under a low-level jet that runs down the valley a few hundred metres up.
function valmere(hourZ: number): Slot {
  const night = hourZ <= 6 || hourZ >= 21
  const jet = { 0: 1.0, 3: 1.1, 6: 0.75, 21: 0.85 }[hourZ] ?? 0
  const heightsM = [10, 60, 120, 200, 300, 400, 500, 600, 800]
  const levels: Level[] = night
    ? heightsM.map((heightM, i) => ({
        heightM,
        directionDeg: [222, 216, 212, 208, 212, 218, 224, 228, 234][i]!,
        speedKt: Math.round([3, 18, 36, 42, 34, 26, 21, 18, 16][i]! * (i === 0 ? 1 : jet)),
      }))
    : heightsM.map((heightM, i) => ({
        heightM,
        directionDeg: [208, 210, 212, 214, 218, 221, 224, 226, 230][i]!,
        speedKt: [12, 14, 15, 16, 17, 18, 19, 20, 22][i]!,
        ...(i === 0 && (hourZ === 12 || hourZ === 15) ? { gustKt: 21 } : {}),
      }))
  return { hourZ, source: 'wind-profiler', levels, entry: { height: 'm', speed: 'kt' },
    notes: night ? 'Valley jet overnight: strong shear below 200 m.' : 'Mixed daytime flow up the valley.' }
}

// Coastal field: offshore land breeze in the morning, a sea breeze turning the surface wind onshore by afternoon,
// return flow above it. Lidar heights in feet, speeds in m/s.
function sorrel(hourZ: number): Slot {
  const heightsFt = [30, 200, 500, 800, 1150, 1650, 1970, 2500]
  const regimes: Record<number, { dir: number[], mps: number[], gustMps?: number }> = {
    0: { dir: [340, 335, 320, 305, 295, 290, 290, 285], mps: [3, 4, 5, 6, 7, 8, 8, 9] },
    3: { dir: [345, 338, 322, 306, 296, 290, 288, 285], mps: [3, 4, 5, 6, 7, 8, 9, 9] },
    6: { dir: [330, 325, 315, 300, 292, 288, 286, 284], mps: [2, 3, 4, 5, 6, 7, 8, 8] },
    9: { dir: [250, 245, 250, 265, 280, 290, 295, 300], mps: [5, 5, 4, 3, 3, 5, 6, 7] },
    12: { dir: [160, 165, 172, 195, 250, 310, 320, 322], mps: [9, 9, 8, 6, 3, 5, 6, 7], gustMps: 14 },
    15: { dir: [158, 162, 170, 190, 245, 305, 318, 320], mps: [10, 10, 9, 6, 3, 5, 6, 7], gustMps: 15 },
    18: { dir: [180, 182, 188, 205, 260, 300, 310, 315], mps: [6, 6, 5, 4, 3, 4, 5, 6] },
    21: { dir: [200, 205, 215, 240, 275, 295, 300, 305], mps: [3, 3, 3, 3, 4, 5, 6, 6] },
  }
  const r = regimes[hourZ]!
  const levels: Level[] = heightsFt.map((heightFt, i) => ({
    heightFt, directionDeg: r.dir[i]!, speedMps: r.mps[i]!, ...(i === 0 && r.gustMps ? { gustMps: r.gustMps } : {}),
  }))
  return { hourZ, source: hourZ === 21 ? 'model-forecast' : 'doppler-lidar', levels, entry: { height: 'ft', speed: 'mps' },
    notes: hourZ >= 12 && hourZ <= 15 ? 'Sea breeze established; gusty onshore wind across the 07/25 pair.' : undefined }
}

// Elevated field (heights above sea level): strong westerlies aloft mixing down in the afternoon; the midday
// radiosonde reaches the upper troposphere (pressure levels) and gives the convective context.
const HIGH_TARN_ELEVATION_M = 2745
function highTarn(hourZ: number): Slot {
  const aglM = [10, 60, 150, 250, 350, 450, 600, 800, 1100]
  const strong = hourZ >= 15 && hourZ <= 18
  const night = hourZ <= 6 || hourZ >= 21
  if (hourZ === 12) {
    const low: Level[] = [
      { heightM: HIGH_TARN_ELEVATION_M + 10, directionDeg: 140, speedKt: 12, gustKt: 22 },
      { heightM: HIGH_TARN_ELEVATION_M + 150, directionDeg: 155, speedKt: 16 },
      { heightM: HIGH_TARN_ELEVATION_M + 300, directionDeg: 170, speedKt: 20 },
      { heightM: HIGH_TARN_ELEVATION_M + 600, directionDeg: 190, speedKt: 24 },
      { heightM: HIGH_TARN_ELEVATION_M + 1000, directionDeg: 205, speedKt: 28 },
    ]
    const upper: Level[] = [
      { pressureHpa: 600, directionDeg: 225, speedKt: 32 },
      { pressureHpa: 500, directionDeg: 240, speedKt: 40 },
      { pressureHpa: 400, directionDeg: 250, speedKt: 50 },
      { pressureHpa: 300, directionDeg: 258, speedKt: 62 },
      { pressureHpa: 250, directionDeg: 262, speedKt: 70 },
    ]
    return { hourZ, source: 'radiosonde', levels: [...low, ...upper], entry: { height: 'm', speed: 'kt' },
      notes: 'Midday ascent: upslope flow at the surface veering to strong westerlies aloft.' }
  }
  const base = night ? { dir: 275, kt: 8, topKt: 20 } : strong ? { dir: 290, kt: 22, topKt: 48 } : { dir: 285, kt: 14, topKt: 30 }
  const levels: Level[] = aglM.map((h, i) => ({
    heightM: HIGH_TARN_ELEVATION_M + h,
    directionDeg: base.dir + Math.round(i * 1.5),
    speedKt: Math.round(base.kt + (base.topKt - base.kt) * Math.min(1, h / 600)),
    ...(i === 0 && strong ? { gustKt: 34 } : {}),
  }))
  return { hourZ, source: hourZ === 0 ? 'radiosonde' : hourZ === 21 ? 'model-forecast' : 'aircraft-reports', levels,
    entry: { height: 'm', speed: 'kt' }, notes: strong ? 'Westerlies mixing down: tailwind on runway 11.' : undefined }
}

export const DEMO_AIRFIELDS: AirfieldSpec[] = [
  {
    code: 'XVAL', name: 'Valmere Basin', latitudeDeg: 46.9137, longitudeDeg: 9.7412, elevationM: 1180, elevationUnit: 'ft',
    notes: 'Demo field in a narrow valley; night-time jet down the valley.', heightReference: 'AGL',
    runways: [{ midLatDeg: 46.9137, midLonDeg: 9.7412, trueBearingDeg: 47, lengthM: 2200, ends: ['04', '22'], elevationsM: [1176, 1184] }],
    slots: HOURS.map(valmere),
  },
  {
    code: 'XCST', name: 'Cape Sorrel', latitudeDeg: 43.9187, longitudeDeg: -1.4005, elevationM: 12, elevationUnit: 'ft',
    notes: 'Demo coastal field; the sea breeze turns the wind onshore by early afternoon.', heightReference: 'AGL',
    runways: [
      { midLatDeg: 43.9231, midLonDeg: -1.4005, trueBearingDeg: 71, lengthM: 3000, ends: ['07L', '25R'], elevationsM: [11, 14] },
      { midLatDeg: 43.9143, midLonDeg: -1.4005, trueBearingDeg: 71, lengthM: 2600, ends: ['07R', '25L'], elevationsM: [10, 12] },
      { midLatDeg: 43.9187, midLonDeg: -1.3905, trueBearingDeg: 162, lengthM: 1800, ends: ['16', '34'], elevationsM: [12, 9] },
    ],
    slots: HOURS.map(sorrel),
  },
  {
    code: 'XHGH', name: 'High Tarn', latitudeDeg: 38.9725, longitudeDeg: -105.9012, elevationM: HIGH_TARN_ELEVATION_M, elevationUnit: 'ft',
    notes: 'Demo high-elevation field; strong westerlies aloft. Profiles are filed with heights above sea level.', heightReference: 'MSL',
    runways: [{ midLatDeg: 38.9725, midLonDeg: -105.9012, trueBearingDeg: 118, lengthM: 3600, ends: ['11', '29'], elevationsM: [2741, 2750] }],
    slots: HOURS.map(highTarn),
  },
]

const WGS84 = geodesic.Geodesic.WGS84

/** Threshold coordinates half a runway length either side of the midpoint along the bearing (geodesic direct). */
function thresholds(r: RunwaySpec) {
  const a = WGS84.Direct(r.midLatDeg, r.midLonDeg, r.trueBearingDeg + 180, r.lengthM / 2)
  const b = WGS84.Direct(r.midLatDeg, r.midLonDeg, r.trueBearingDeg, r.lengthM / 2)
  const round = (x: number) => Math.round(x * 1e7) / 1e7
  return [{ latDeg: round(a.lat2!), lonDeg: round(a.lon2!) }, { latDeg: round(b.lat2!), lonDeg: round(b.lon2!) }] as const
}

export function demoDayStart(now = new Date()) {
  return new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate()))
}

export async function seedDemoAirfields(db: SeedDB) {
  const [dispatcher] = await db.select().from(schema.users).where(eq(schema.users.email, 'dispatch@veerline.example'))
  const filedByUserId = dispatcher?.id ?? null
  const actorLabel = dispatcher?.email ?? 'demo seed'
  const dayStart = demoDayStart()

  for (const a of DEMO_AIRFIELDS) {
    const [{ id: airfieldId }] = await db.insert(schema.airfields).values({
      code: a.code, name: a.name, latitudeDeg: a.latitudeDeg, longitudeDeg: a.longitudeDeg, elevationM: a.elevationM,
      elevationUnit: a.elevationUnit, notes: a.notes,
    }).$returningId() as [{ id: number }]
    await db.insert(schema.auditLog).values({ actorUserId: filedByUserId, actorLabel, action: 'airfield.create', entityType: 'airfield', entityId: String(airfieldId), details: { code: a.code, demo: true } })

    for (const r of a.runways) {
      const [t1, t2] = thresholds(r)
      const [{ id: runwayId }] = await db.insert(schema.runways).values({ airfieldId, lengthM: r.lengthM }).$returningId() as [{ id: number }]
      await db.insert(schema.runwayEnds).values([
        { runwayId, airfieldId, designator: r.ends[0], thresholdLatDeg: t1.latDeg, thresholdLonDeg: t1.lonDeg, thresholdElevationM: r.elevationsM[0],
          trueHeadingDeg: runwayTrueBearingDeg(t1.latDeg, t1.lonDeg, t2.latDeg, t2.lonDeg), headingSource: 'coordinates' },
        { runwayId, airfieldId, designator: r.ends[1], thresholdLatDeg: t2.latDeg, thresholdLonDeg: t2.lonDeg, thresholdElevationM: r.elevationsM[1],
          trueHeadingDeg: runwayTrueBearingDeg(t2.latDeg, t2.lonDeg, t1.latDeg, t1.lonDeg), headingSource: 'coordinates' },
      ])
    }

    for (const slot of a.slots) {
      const validFrom = new Date(dayStart.getTime() + slot.hourZ * 3600_000)
      const validTo = new Date(validFrom.getTime() + 3 * 3600_000)
      const [{ id: profileId }] = await db.insert(schema.profiles).values({
        airfieldId, validFrom, validTo, source: slot.source, heightReference: a.heightReference,
        filedByUserId, entry: { ...slot.entry, method: 'demo' }, notes: slot.notes ?? null,
        createdAt: new Date(validFrom.getTime() - 20 * 60_000),
      }).$returningId() as [{ id: number }]
      await db.insert(schema.profileLevels).values(slot.levels.map((l, seq) => ({ profileId, seq, ...l })))
      await db.insert(schema.auditLog).values({ actorUserId: filedByUserId, actorLabel, action: 'profile.file', entityType: 'profile', entityId: String(profileId), details: { airfield: a.code, demo: true } })
    }
  }
}

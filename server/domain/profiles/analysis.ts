import type { Airfield, Profile, ProfileLevel, RunwayEnd } from '../../db/schema'
import {
  analyseProfile, magneticDeclinationDeg, magneticFromTrue,
  type LevelInput, type ProfileAnalysis, type RunwayEndInput, type ShearClassBoundsKtPer100ft,
} from '../../../shared/wind'
import { asc, eq, inArray, schema, useDB } from '../../utils/db'
import type { DB, Tx } from '../../utils/db'

/** Magnetic variation (east positive) for an airfield on a date: its override, or the World Magnetic Model. */
export function airfieldDeclination(airfield: Airfield, date: Date) {
  if (airfield.magVarOverrideDeg != null) {
    return { declinationDeg: airfield.magVarOverrideDeg, source: 'override' as const, reason: airfield.magVarOverrideReason, date }
  }
  const declinationDeg = magneticDeclinationDeg({
    latDeg: airfield.latitudeDeg, lonDeg: airfield.longitudeDeg, elevationM: airfield.elevationM, date,
  })
  return { declinationDeg, source: 'wmm2025' as const, reason: null, date }
}

/** The levels of a stored profile in the engine's input shape (only the fields that were filed). */
export function levelInputsOf(rows: ProfileLevel[]): LevelInput[] {
  return [...rows].sort((a, b) => a.seq - b.seq).map((r) => {
    const level: LevelInput = { directionDeg: r.directionDeg }
    if (r.heightM != null) level.heightM = r.heightM
    if (r.heightFt != null) level.heightFt = r.heightFt
    if (r.pressureHpa != null) level.pressureHpa = r.pressureHpa
    if (r.speedKt != null) level.speedKt = r.speedKt
    if (r.speedMps != null) level.speedMps = r.speedMps
    if (r.gustKt != null) level.gustKt = r.gustKt
    if (r.gustMps != null) level.gustMps = r.gustMps
    if (r.temperatureC != null) level.temperatureC = r.temperatureC
    return level
  })
}

export function runwayEndInputsOf(ends: RunwayEnd[], declinationDeg: number | null): RunwayEndInput[] {
  return [...ends].sort((a, b) => a.designator.localeCompare(b.designator)).map(e => ({
    designator: e.designator,
    trueHeadingDeg: e.trueHeadingDeg,
    ...(declinationDeg == null ? {} : { magneticHeadingDeg: magneticFromTrue(e.trueHeadingDeg, declinationDeg) }),
  }))
}

export type StoredProfileAnalysis = {
  profile: Profile
  airfield: Airfield
  runwayEnds: RunwayEnd[]
  levels: ProfileLevel[]
  declination: ReturnType<typeof airfieldDeclination>
  analysis: ProfileAnalysis
}

/** Runs the wind engine on a stored profile with its airfield's runway ends (magnetic variation on the profile's date). */
export function analyseStored(profile: Profile, airfield: Airfield, runwayEnds: RunwayEnd[], levels: ProfileLevel[],
  shearClassBoundsKtPer100ft?: Partial<ShearClassBoundsKtPer100ft>): StoredProfileAnalysis {
  const declination = airfieldDeclination(airfield, profile.validFrom)
  const analysis = analyseProfile({
    levels: levelInputsOf(levels),
    heightReference: profile.heightReference,
    elevationM: airfield.elevationM,
    runwayEnds: runwayEndInputsOf(runwayEnds, declination.declinationDeg),
    shearClassBoundsKtPer100ft,
    ...pressureInputsOf(profile, airfield),
  })
  return { profile, airfield, runwayEnds, levels, declination, analysis }
}

/** QNH, station pressure and the airfield's path settings, as the engine takes them (only what is set). */
export function pressureInputsOf(p: { qnhHpa?: number | null, surfacePressureHpa?: number | null }, airfield: Airfield) {
  return {
    ...(p.qnhHpa == null ? {} : { qnhHpa: p.qnhHpa }),
    ...(p.surfacePressureHpa == null ? {} : { surfacePressureHpa: p.surfacePressureHpa }),
    ...(airfield.pathSettings ? { paths: airfield.pathSettings } : {}),
  }
}

/** Loads profiles with their airfield, runway ends and levels, and analyses each. */
export async function loadAndAnalyseProfiles(profileIds: number[], db: DB | Tx = useDB()): Promise<StoredProfileAnalysis[]> {
  if (!profileIds.length) return []
  const profileRows = await db.select().from(schema.profiles).where(inArray(schema.profiles.id, profileIds))
  if (!profileRows.length) return []
  const airfieldIds = [...new Set(profileRows.map(p => p.airfieldId))]
  const [airfieldRows, endRows, levelRows] = await Promise.all([
    db.select().from(schema.airfields).where(inArray(schema.airfields.id, airfieldIds)),
    db.select().from(schema.runwayEnds).where(inArray(schema.runwayEnds.airfieldId, airfieldIds)),
    db.select().from(schema.profileLevels).where(inArray(schema.profileLevels.profileId, profileRows.map(p => p.id)))
      .orderBy(asc(schema.profileLevels.profileId), asc(schema.profileLevels.seq)),
  ])
  return profileRows.map((p) => {
    const airfield = airfieldRows.find(a => a.id === p.airfieldId)!
    return analyseStored(p, airfield, endRows.filter(e => e.airfieldId === p.airfieldId), levelRows.filter(l => l.profileId === p.id))
  })
}

export async function loadAndAnalyseProfile(profileId: number, db: DB | Tx = useDB()) {
  const [one] = await loadAndAnalyseProfiles([profileId], db)
  return one ?? null
}

export async function airfieldByCode(code: string, db: DB | Tx = useDB()) {
  const [row] = await db.select().from(schema.airfields).where(eq(schema.airfields.code, code.toUpperCase()))
  return row ?? null
}

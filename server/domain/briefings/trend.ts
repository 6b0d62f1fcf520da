import type { Airfield, Profile, RunwayEnd } from '../../db/schema'
import { analyseStored } from '../profiles/analysis'
import { and, asc, desc, eq, gte, inArray, lt, lte, ne, schema, useDB } from '../../utils/db'
import { effectiveLimits } from '../alerts/limits'
import { profileStatus, publicAirfield } from './briefing'

const DAY_MS = 86_400_000

/** The UTC day to chart: the one asked for, else the day of the newest profile begun by now, else today. */
async function trendDay(airfieldId: number, date: string | undefined, now: Date): Promise<Date> {
  if (date) return new Date(`${date}T00:00:00Z`)
  const p = schema.profiles
  const [latest] = await useDB().select({ validFrom: p.validFrom }).from(p)
    .where(and(eq(p.airfieldId, airfieldId), ne(p.status, 'withdrawn'), lte(p.validFrom, now)))
    .orderBy(desc(p.validFrom)).limit(1)
  const base = latest?.validFrom ?? now
  return new Date(Math.floor(base.getTime() / DAY_MS) * DAY_MS)
}

/** One point per profile of the day (withdrawn ones left out): strongest shear and each end's surface figures. */
export async function loadTrend(airfield: Airfield, ends: RunwayEnd[], date: string | undefined) {
  const now = new Date()
  const day = await trendDay(airfield.id, date, now)
  const db = useDB()
  const p = schema.profiles
  const profiles: Profile[] = await db.select().from(p)
    .where(and(eq(p.airfieldId, airfield.id), ne(p.status, 'withdrawn'), gte(p.validFrom, day),
      lt(p.validFrom, new Date(day.getTime() + DAY_MS))))
    .orderBy(asc(p.validFrom), asc(p.id))
  const levels = profiles.length
    ? await db.select().from(schema.profileLevels).where(inArray(schema.profileLevels.profileId, profiles.map(x => x.id)))
    : []
  const limitSet = await effectiveLimits(airfield.id)
  const designators = [...ends].map(e => e.designator).sort()
  const points = profiles.map((profile) => {
    const { analysis } = analyseStored(profile, airfield, ends, levels.filter(l => l.profileId === profile.id))
    const strongest = analysis.shear.strongestLayer
    return {
      profileId: profile.id,
      at: profile.validFrom.toISOString(),
      validTo: profile.validTo.toISOString(),
      source: profile.source,
      status: profileStatus(profile, now),
      strongestShearKtPer100ft: strongest?.shearKtPer100ft ?? null,
      strongestShearIntensity: strongest?.intensity ?? null,
      strongestLayer: strongest ? { baseM: strongest.baseM, topM: strongest.topM } : null,
      ends: analysis.runwayEnds.map(e => ({
        designator: e.designator,
        crosswindKt: e.surface ? Math.abs(e.surface.crosswindKt) : null,
        gustCrosswindKt: e.surface?.gustCrosswindKt != null ? Math.abs(e.surface.gustCrosswindKt) : null,
        tailwindKt: e.surface ? Math.max(0, -e.surface.headwindKt) : null,
        gustTailwindKt: e.surface?.gustHeadwindKt != null ? Math.max(0, -e.surface.gustHeadwindKt) : null,
      })),
    }
  })
  return {
    airfield: publicAirfield(airfield, ends),
    date: day.toISOString().slice(0, 10),
    designators,
    limits: {
      source: limitSet.source,
      maxLayerShearKtPer100ft: limitSet.limits.maxLayerShearKtPer100ft,
      perEnd: designators.map(d => ({ designator: d, maxCrosswindKt: limitSet.limitsFor(d).maxCrosswindKt,
        maxTailwindKt: limitSet.limitsFor(d).maxTailwindKt })),
    },
    points,
  }
}

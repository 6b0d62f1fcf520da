import { z } from 'zod'
import { MAX_HEIGHT_AGL_M, MAX_LEVELS, MAX_RUNWAY_ENDS, MAX_SPEED_KT } from './validate'
import { KMH_PER_KT, M_PER_FT, MPS_PER_KT } from '../units'
import { designatorHeadingDeg } from './runway'

/*
 * Zod schemas for forms and routes. They check the shape and single-field ranges so a form can show a field
 * error early; the engine's own `normaliseProfile` remains the authority (ground, duplicates, surface gust).
 */

const nonNegative = z.number().finite().nonnegative()
const speedKtMax = MAX_SPEED_KT
const HEIGHT_KEYS = ['heightM', 'heightFt', 'pressureHpa'] as const
const SPEED_KEYS = ['speedKt', 'speedMps', 'speedKmh'] as const
const GUST_KEYS = ['gustKt', 'gustMps', 'gustKmh'] as const

export const levelInputSchema = z.object({
  heightM: z.number().finite().max(MAX_HEIGHT_AGL_M + 9000).optional(),
  heightFt: z.number().finite().max((MAX_HEIGHT_AGL_M + 9000) / M_PER_FT).optional(),
  pressureHpa: z.number().finite().positive().max(1100).optional(),
  directionDeg: z.number().finite().min(0).max(360),
  speedKt: nonNegative.max(speedKtMax).optional(),
  speedMps: nonNegative.max(speedKtMax * MPS_PER_KT).optional(),
  speedKmh: nonNegative.max(speedKtMax * KMH_PER_KT).optional(),
  gustKt: nonNegative.max(speedKtMax).optional(),
  gustMps: nonNegative.max(speedKtMax * MPS_PER_KT).optional(),
  gustKmh: nonNegative.max(speedKtMax * KMH_PER_KT).optional(),
}).superRefine((level, ctx) => {
  const count = (keys: readonly (keyof typeof level)[]): number => keys.filter(k => level[k] !== undefined).length
  if (count(HEIGHT_KEYS) !== 1) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['heightM'], message: 'give exactly one of heightM, heightFt, pressureHpa' })
  if (count(SPEED_KEYS) !== 1) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['speedKt'], message: 'give exactly one of speedKt, speedMps, speedKmh' })
  if (count(GUST_KEYS) > 1) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['gustKt'], message: 'give at most one gust field' })
})

export const profileLevelsSchema = z.array(levelInputSchema).min(2, 'at least two levels are needed').max(MAX_LEVELS)

export const runwayEndInputSchema = z.object({
  designator: z.string().refine(d => designatorHeadingDeg(d) !== null, 'a runway designator 01 to 36, optionally L, C or R'),
  trueHeadingDeg: z.number().finite().min(0).max(360),
  magneticHeadingDeg: z.number().finite().min(0).max(360).optional(),
})

export const profileAnalysisInputSchema = z.object({
  levels: profileLevelsSchema,
  heightReference: z.enum(['AGL', 'MSL']),
  elevationM: z.number().finite().min(-500).max(9000).optional(),
  runwayEnds: z.array(runwayEndInputSchema).max(MAX_RUNWAY_ENDS).optional(),
  shearClassBoundsKtPer100ft: z.object({
    lightMaxKtPer100ft: z.number().positive().optional(),
    moderateMaxKtPer100ft: z.number().positive().optional(),
    strongMaxKtPer100ft: z.number().positive().optional(),
  }).optional(),
})

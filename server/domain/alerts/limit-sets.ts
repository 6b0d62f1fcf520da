// Pure helpers for limit sets: layering (organisation → airfield → runway end) and validation against LIMIT_RANGES.
import { z } from 'zod'
import { DEFAULT_LIMITS, LIMIT_RANGES, withUnit, type Limits } from '../../../shared/limits'

export const LIMIT_KEYS = Object.keys(LIMIT_RANGES) as (keyof Limits)[]
export type PartialLimits = { [K in keyof Limits]: number | null }

export type LimitSource = 'built-in default' | 'organisation' | 'airfield' | 'runway end'

/** Applies overrides in order; a null or missing value inherits. Tells, per figure, which level set it. */
export function layerLimits(layers: { source: LimitSource, values: Partial<PartialLimits> | null | undefined }[]) {
  const limits: Limits = { ...DEFAULT_LIMITS }
  const source = Object.fromEntries(LIMIT_KEYS.map(k => [k, 'built-in default'])) as Record<keyof Limits, LimitSource>
  for (const layer of layers) {
    if (!layer.values) continue
    for (const k of LIMIT_KEYS) {
      const v = layer.values[k]
      if (v != null) {
        limits[k] = v
        source[k] = layer.source
      }
    }
  }
  return { limits, source }
}

const limitField = (k: keyof Limits) => {
  const r = LIMIT_RANGES[k]
  return z.number({ invalid_type_error: r.unit ? `${r.label} must be a number in ${r.unit}` : `${r.label} must be a number` })
    .min(r.min, `${r.label} must be at least ${withUnit(r.min, r.unit)}`)
    .max(r.max, `${r.label} must be at most ${withUnit(r.max, r.unit)}`)
}

/** Body of a limit change: the values (null = inherit, not allowed for the organisation set) and a reason. */
export const limitChangeSchema = z.object({
  values: z.object(Object.fromEntries(LIMIT_KEYS.map(k => [k, limitField(k).nullable().optional()])) as Record<keyof Limits, z.ZodOptional<z.ZodNullable<z.ZodNumber>>>)
    .strict(),
  reason: z.string({ required_error: 'Give a reason for the change' }).trim()
    .min(5, 'Give a reason for the change (at least 5 characters)').max(500, 'Keep the reason under 500 characters'),
})

/** `?dryRun=1` on a limit change: answer what it would do, save nothing. */
export const dryRunQuerySchema = z.object({
  dryRun: z.enum(['1', 'true', '0', 'false'], { errorMap: () => ({ message: 'dryRun must be 1 or 0' }) }).optional()
    .transform(v => v === '1' || v === 'true'),
})

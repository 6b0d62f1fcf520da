import { z } from 'zod'
import { LIMIT_RANGES, withUnit } from '~~/shared/limits'

// The limit form's schema: the same ranges and messages as the server (LIMIT_RANGES), blank = inherit.
export const LIMIT_FIELDS = ['maxCrosswindKt', 'maxTailwindKt', 'maxLayerShearKtPer100ft', 'maxVectorDiff600mKt', 'maxAirspeedLossKt', 'maxFFactor', 'nearLimitMarginPct'] as const
export type LimitFieldKey = typeof LIMIT_FIELDS[number]
// LIMIT_RANGES is plain data in a framework-free module, so the form and the server read the same numbers.
const RANGES = LIMIT_RANGES
const field = (k: LimitFieldKey) => z.preprocess(v => (v === '' || v === null || (typeof v === 'number' && Number.isNaN(v)) ? undefined : v),
  z.number({ invalid_type_error: `${RANGES[k].label} must be a number` }).min(RANGES[k].min, `${RANGES[k].label} must be at least ${withUnit(RANGES[k].min, RANGES[k].unit)}`)
    .max(RANGES[k].max, `${RANGES[k].label} must be at most ${withUnit(RANGES[k].max, RANGES[k].unit)}`).optional())
export const limitChangeFormSchema = z.object({
  ...Object.fromEntries(LIMIT_FIELDS.map(k => [k, field(k)])) as Record<LimitFieldKey, ReturnType<typeof field>>,
  reason: z.string({ required_error: 'Give a reason for the change' }).trim().min(5, 'Give a reason for the change (at least 5 characters)').max(500, 'Keep the reason under 500 characters'),
})

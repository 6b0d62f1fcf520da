import { z } from 'zod'
import { airfieldCodeSchema } from './airfield-schema'
import { calendarDateSchema, idSchema, instantSchema, INT_ID_MAX, parseInstant } from './input-schemas'

// Route pieces for briefings, trends and read receipts (server and client read the same messages).
const isoTime = z.string().trim().pipe(instantSchema('at')).transform(s => new Date((parseInstant(s) as { ms: number }).ms))

export const briefingQuerySchema = z.object({
  at: isoTime.optional(),
  profile: idSchema('profile').optional(),
  // 'trade' (the default): figures rounded to the trade's precision and levels thinned for display;
  // 'full': every level and every figure as the engine computed it.
  precision: z.enum(['trade', 'full'], { errorMap: () => ({ message: 'must be trade or full' }) }).optional(),
  // Which runway ends carry their detailed figures: 'all' (the default), or the end a page shows (a designator such
  // as 27L; one the airfield lacks, or 'best', gives the best-ranked end). The ranking and verdict list every end.
  end: z.string().trim().regex(/^(all|best|(0[1-9]|[12]\d|3[0-6])[LCR]?)$/i, 'must be a runway end designator such as 09 or 27L, best or all')
    .transform(s => (/^(all|best)$/i.test(s) ? s.toLowerCase() : s.toUpperCase())).optional(),
}).strict()

export const trendQuerySchema = z.object({
  date: z.string().trim().pipe(calendarDateSchema('date')).optional(),
}).strict()

export const receiptBodySchema = z.object({
  profileId: z.number({ required_error: 'profileId is required', invalid_type_error: 'profileId must be a number' })
    .int('profileId must be a whole number').positive('profileId must be positive').max(INT_ID_MAX, 'profileId is not a profile'),
}).strict()

export const receiptQuerySchema = z.object({
  airfield: airfieldCodeSchema.optional(),
  profile: idSchema('profile').optional(),
}).strict()

import { z } from 'zod'
import { airfieldCodeSchema } from './airfield-schema'

// Route pieces for briefings, trends and read receipts (server and client read the same messages).
const isoTime = z.string().trim().refine(s => /^\d{4}-\d{2}-\d{2}T/.test(s) && !Number.isNaN(Date.parse(s)),
  { message: 'must be an ISO 8601 time such as 2026-03-01T06:00:00Z' }).transform(s => new Date(s))

export const briefingQuerySchema = z.object({
  at: isoTime.optional(),
  profile: z.coerce.number({ invalid_type_error: 'must be a profile id' }).int('must be a whole number')
    .positive('must be a positive profile id').optional(),
  // 'trade' (the default): figures rounded to the trade's precision and levels thinned for display;
  // 'full': every level and every figure as the engine computed it.
  precision: z.enum(['trade', 'full'], { errorMap: () => ({ message: 'must be trade or full' }) }).optional(),
}).strict()

export const trendQuerySchema = z.object({
  date: z.string().trim().regex(/^\d{4}-\d{2}-\d{2}$/, 'must be a UTC date such as 2026-03-01')
    .refine(s => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)), 'is not a real date').optional(),
}).strict()

export const receiptBodySchema = z.object({
  profileId: z.number({ required_error: 'profileId is required', invalid_type_error: 'profileId must be a number' })
    .int('profileId must be a whole number').positive('profileId must be positive'),
}).strict()

export const receiptQuerySchema = z.object({
  airfield: airfieldCodeSchema.optional(),
  profile: z.coerce.number().int().positive('must be a positive profile id').optional(),
}).strict()

import { z } from 'zod'

// Input pieces that refuse what would otherwise pass a loose check and fail later (a date that is no date, an
// offset no clock uses, "0x1b" or "1e300" as a whole number). Shared by routes and forms.

/** Instants are taken from 1970-01-01T00:00Z to 2100-12-31T23:59:59.999Z: wind profiles, not history or far future. */
export const INSTANT_MIN_MS = Date.UTC(1970, 0, 1)
export const INSTANT_MAX_MS = Date.UTC(2101, 0, 1) - 1
export const INSTANT_RANGE_TEXT = '1970 to 2100'

const ISO_INSTANT = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2})(\.\d{1,9})?)?(?:(Z)|([+-])(\d{2}):?(\d{2}))$/

const daysIn = (year: number, month: number) => new Date(Date.UTC(year, month, 0)).getUTCDate()

/**
 * The epoch milliseconds of an ISO 8601 date and time with a Z or an offset (ISO 8601-1:2019 §5.4, RFC 3339 §5.6),
 * or a reason it is not one. Real calendar dates only (no 30 February); offsets as clocks use them: at most 14 hours,
 * in quarter hours (every offset in the IANA time zone database lies between -12:00 and +14:00 and is a multiple of
 * 15 minutes; common practice). Within 1970 to 2100.
 */
export function parseInstant(text: string): { ms: number } | { problem: string } {
  const m = ISO_INSTANT.exec(text)
  if (!m) return { problem: 'must be an ISO 8601 date and time with Z or an offset, e.g. 2026-05-01T06:00:00Z' }
  const [, y, mo, d, h, mi, s, frac, z, sign, oh, om] = m
  const year = Number(y)
  const month = Number(mo)
  const day = Number(d)
  if (month < 1 || month > 12) return { problem: `has no month ${mo}` }
  if (day < 1 || day > daysIn(year, month)) return { problem: `${y}-${mo} has no day ${d}` }
  if (Number(h) > 23 || Number(mi) > 59 || Number(s ?? 0) > 59) return { problem: `has no time ${h}:${mi}${s ? `:${s}` : ''}` }
  let offsetMin = 0
  if (!z) {
    const hours = Number(oh)
    const minutes = Number(om)
    if (hours > 14 || minutes > 59 || minutes % 15 !== 0 || hours * 60 + minutes > 14 * 60) {
      return { problem: `has the offset ${sign}${oh}:${om}, which no clock uses (offsets run from -12:00 to +14:00)` }
    }
    offsetMin = (sign === '-' ? -1 : 1) * (hours * 60 + minutes)
  }
  const ms = Date.UTC(year, month - 1, day, Number(h), Number(mi), Number(s ?? 0), Math.floor(Number(`0${frac ?? ''}`) * 1000)) - offsetMin * 60_000
  if (!(ms >= INSTANT_MIN_MS && ms <= INSTANT_MAX_MS)) return { problem: `must fall in the years ${INSTANT_RANGE_TEXT}` }
  return { ms }
}

/** A string holding a real instant (see parseInstant); the string is kept as given. */
export const instantSchema = (label: string) => z.string({ required_error: `${label} is required`, invalid_type_error: `${label} must be a date and time` })
  .superRefine((text, ctx) => {
    const r = parseInstant(text)
    if ('problem' in r) ctx.addIssue({ code: z.ZodIssueCode.custom, message: `${label} ${r.problem}` })
  })

/** A calendar date YYYY-MM-DD that exists (no 2026-02-30), in 1970 to 2100. */
export const calendarDateSchema = (label: string) => z.string({ required_error: `${label} is required` })
  .superRefine((text, ctx) => {
    const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text)
    if (!m) return ctx.addIssue({ code: z.ZodIssueCode.custom, message: `${label} must be a date as YYYY-MM-DD` })
    const r = parseInstant(`${text}T00:00:00Z`)
    if ('problem' in r) ctx.addIssue({ code: z.ZodIssueCode.custom, message: `${label} ${r.problem}` })
  })

/**
 * A whole number written in plain decimal digits (no sign, exponent, hex, spaces or fraction), from `min` to `max`:
 * "27" is 27, "0x1b", "1e3", " 2" and "2.0" are refused. Numbers in a JSON body pass when they are such integers.
 */
export const decimalIntSchema = (label: string, min: number, max: number) => z.union([z.string(), z.number()], {
  errorMap: () => ({ message: `${label} must be a whole number` }),
}).transform((value, ctx) => {
  const text = typeof value === 'number' ? (Number.isSafeInteger(value) ? String(value) : '') : value
  if (!/^\d{1,15}$/.test(text)) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, message: `${label} must be a whole number written in digits, from ${min} to ${max}` })
    return z.NEVER
  }
  const n = Number(text)
  if (n < min || n > max) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, message: `${label} must be from ${min} to ${max}` })
    return z.NEVER
  }
  return n
})

/** Database ids: plain decimal, 1 to 2^31 - 1 (a signed INT column's largest value, MariaDB documentation). */
export const INT_ID_MAX = 2_147_483_647
export const idSchema = (label = 'id') => decimalIntSchema(label, 1, INT_ID_MAX)
/** Page numbers stop at 100,000: past that, a list is read another way (a page of 200 covers 20 million rows). */
export const PAGE_MAX = 100_000
export const pageSchema = decimalIntSchema('page', 1, PAGE_MAX).default(1)
export const pageSizeSchema = (max: number, fallback: number) => decimalIntSchema('pageSize', 1, max).default(fallback)

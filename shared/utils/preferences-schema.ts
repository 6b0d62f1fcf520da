// The preferences body (PUT /api/preferences). Kept apart from display-units.ts so that pages which only
// format figures do not load zod.
import { z } from 'zod'

export const preferencesSchema = z.object({
  speedUnit: z.enum(['kt', 'mps'], { errorMap: () => ({ message: 'Speed unit must be kt or mps' }) }).optional(),
  heightUnit: z.enum(['ft', 'm'], { errorMap: () => ({ message: 'Height unit must be ft or m' }) }).optional(),
  headingRef: z.enum(['true', 'magnetic'], { errorMap: () => ({ message: 'Headings must be true or magnetic' }) }).optional(),
}).strict().refine(v => Object.keys(v).length > 0, { message: 'Nothing to change: give speedUnit, heightUnit or headingRef' })

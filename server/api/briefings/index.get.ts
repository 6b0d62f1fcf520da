import { briefingSummaries } from '../../domain/briefings/briefing'
// Every airfield with the state of its briefing now: the profile in force and how many limits it crosses.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'admin', 'dispatcher', 'pilot', 'safety')
  return { airfields: await briefingSummaries(), caution: VEERLINE_CAUTION }
})

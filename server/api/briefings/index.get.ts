import { readBriefingSummaries } from '../../domain/briefings/read'

// Every airfield with the state of its briefing now: the profile in force and how many limits it crosses.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'admin', 'dispatcher', 'pilot', 'safety')
  return { airfields: await readBriefingSummaries(), caution: VEERLINE_CAUTION }
})

import { readBriefingSummaries } from '../../domain/briefings/read'

// Every airfield with the state of its briefing now: the profile in force and how many limits it crosses.
export default defineApiHandler(async (event) => {
  await requireCapability(event, 'read-briefings')
  return { airfields: await readBriefingSummaries(), caution: VEERLINE_CAUTION }
})

import { readAirfieldList } from '../../domain/airfields/list-read'

// Every airfield with the profile in force now (or the next one), for the airfield list.
export default defineApiHandler(async (event) => {
  await requireUser(event)
  const now = new Date()
  return { airfields: await readAirfieldList(now), at: now.toISOString() }
})

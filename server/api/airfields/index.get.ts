import { airfieldListJson, type AirfieldListAnswer } from '../../domain/airfields/list-read'

// Every airfield with the profile in force now (or the next one), for the airfield list.
export default defineApiHandler(async (event) => {
  await requireUser(event)
  const text = await airfieldListJson()
  setResponseHeader(event, 'content-type', 'application/json; charset=utf-8')
  // JSON text shared by the requests that came together; typed as what it spells for the pages' fetches.
  return text as unknown as AirfieldListAnswer
})

import { airfieldSummary, profileStateOf } from '../../domain/airfields'
// Every airfield with the profile in force now (or the next one), for the airfield list.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const rows = await useDB().select().from(schema.airfields).orderBy(asc(schema.airfields.code))
  const ends = await useDB().select({ airfieldId: schema.runwayEnds.airfieldId, designator: schema.runwayEnds.designator })
    .from(schema.runwayEnds).orderBy(asc(schema.runwayEnds.designator))
  const now = new Date()
  const airfields = await Promise.all(rows.map(async a => ({
    ...airfieldSummary(a),
    runwayEnds: ends.filter(e => e.airfieldId === a.id).map(e => e.designator),
    profileState: await profileStateOf(a.id, now),
  })))
  return { airfields, at: now.toISOString() }
})

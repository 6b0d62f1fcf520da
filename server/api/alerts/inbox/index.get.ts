// The signed-in user's alerts inbox, newest first, with the count not yet acknowledged.
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const i = schema.alertInbox
  const a = schema.alerts
  const rows = await useDB().select({
    id: i.id, event: i.event, title: i.title, acknowledgedAt: i.acknowledgedAt, createdAt: i.createdAt,
    alert: { id: a.id, designator: a.designator, kind: a.kind, value: a.value, limit: a.limitValue, unit: a.unit, excess: a.excess,
      message: a.message, state: a.state, clearReason: a.clearReason, profileId: a.profileId },
    airfieldCode: schema.airfields.code, airfieldName: schema.airfields.name,
    validFrom: schema.profiles.validFrom, validTo: schema.profiles.validTo,
  }).from(i)
    .innerJoin(a, eq(a.id, i.alertId))
    .innerJoin(schema.airfields, eq(schema.airfields.id, a.airfieldId))
    .innerJoin(schema.profiles, eq(schema.profiles.id, a.profileId))
    .where(eq(i.userId, user.id))
    .orderBy(desc(i.id))
    .limit(200)
  const [count] = await useDB().select({ n: sql<number>`COUNT(*)` }).from(i).where(and(eq(i.userId, user.id), isNull(i.acknowledgedAt)))
  return { items: rows, unacknowledged: Number(count?.n ?? 0) }
})

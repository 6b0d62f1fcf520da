// The signed-in user's subscriptions (airfields × channels) and the airfields there are to choose from.
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const s = schema.alertSubscriptions
  const [subs, airfields, devices] = await Promise.all([
    useDB().select({ airfieldCode: schema.airfields.code, airfieldName: schema.airfields.name, email: s.email, push: s.push })
      .from(s).innerJoin(schema.airfields, eq(schema.airfields.id, s.airfieldId)).where(eq(s.userId, user.id)).orderBy(schema.airfields.code),
    useDB().select({ code: schema.airfields.code, name: schema.airfields.name }).from(schema.airfields).orderBy(schema.airfields.code),
    useDB().select({ n: sql<number>`COUNT(*)` }).from(schema.pushSubscriptions).where(eq(schema.pushSubscriptions.userId, user.id)),
  ])
  return { subscriptions: subs, airfields, pushDevices: Number(devices[0]?.n ?? 0) }
})

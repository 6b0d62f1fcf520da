// How many inbox entries the signed-in user has not acknowledged (the badge in the navigation).
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const i = schema.alertInbox
  const [count] = await useDB().select({ n: sql<number>`COUNT(*)` }).from(i).where(and(eq(i.userId, user.id), isNull(i.acknowledgedAt)))
  return { unacknowledged: Number(count?.n ?? 0) }
})

import { receiptBodySchema } from '#shared/utils/briefing-schemas'
import { receiptOf } from '../../domain/briefings/receipts'

// A pilot marks the briefing of one profile version as read. Marking it again changes nothing (200).
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'record-receipt')
  const body = await readBodyWith(event, receiptBodySchema, 'The read receipt is not valid')
  const { profileId } = body
  const created = await useDB().transaction(async (tx) => {
    const [profile] = await tx.select().from(schema.profiles).where(eq(schema.profiles.id, profileId))
    if (!profile) throw createError({ statusCode: 404, statusMessage: `No profile with id ${profileId}` })
    const [existing] = await tx.select().from(schema.briefingReceipts)
      .where(and(eq(schema.briefingReceipts.userId, user.id), eq(schema.briefingReceipts.profileId, profileId)))
    if (existing) return false
    const [inserted] = await tx.insert(schema.briefingReceipts)
      .values({ userId: user.id, profileId, airfieldId: profile.airfieldId, readAt: new Date() }).$returningId()
    await recordAudit(tx, { user }, 'briefing.read', 'profile', profileId, { receiptId: inserted?.id, airfieldId: profile.airfieldId })
    return true
  })
  setResponseStatus(event, created ? 201 : 200)
  return { receipt: await receiptOf(user.id, profileId), created }
})

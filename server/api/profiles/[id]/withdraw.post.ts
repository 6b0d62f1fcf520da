import { idParamSchema } from '#shared/utils/schemas'
import { withdrawSchema } from '#shared/utils/profile-schema'
import { publicProfile } from '../../../domain/profiles/filing'
import { evaluateAirfield } from '../../../domain/alerts/evaluate'

// Withdraws an active profile with a reason; it stays, marked. The airfield's alerts are evaluated in the same transaction.
export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'withdraw-profile')
  const { id } = readParams(event, idParamSchema)
  const body = await readBodyWith(event, withdrawSchema)
  const p = schema.profiles
  const result = await useDB().transaction(async (tx) => {
    const [row] = await tx.select().from(p).where(eq(p.id, id)).for('update')
    if (!row) return { missing: true as const }
    if (row.status !== 'active') return { status: row.status }
    const at = new Date()
    await tx.update(p).set({ status: 'withdrawn', withdrawnAt: at, withdrawnReason: body.reason, withdrawnByUserId: user.id })
      .where(and(eq(p.id, id), eq(p.status, 'active')))
    await recordAudit(tx, { user }, 'profile.withdraw', 'profile', id, { reason: body.reason })
    await evaluateAirfield(tx, row.airfieldId, { trigger: 'profile.withdraw', actor: { user } })
    const [after] = await tx.select({ profile: p, code: schema.airfields.code }).from(p)
      .innerJoin(schema.airfields, eq(schema.airfields.id, p.airfieldId)).where(eq(p.id, id))
    const levels = await tx.select().from(schema.profileLevels).where(eq(schema.profileLevels.profileId, id)).orderBy(asc(schema.profileLevels.seq))
    return { profile: publicProfile(after!.profile, after!.code, levels) }
  })
  if ('missing' in result) throw createError({ statusCode: 404, statusMessage: `No profile ${id}` })
  if ('status' in result) throw createError({ statusCode: 409, statusMessage: `Profile ${id} is ${result.status}; only an active profile can be withdrawn` })
  return { profile: result.profile }
})

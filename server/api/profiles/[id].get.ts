import { idParamSchema } from '#shared/utils/schemas'
import { publicProfile } from '../../domain/profiles/filing'

// One profile as filed, with its history links (what it superseded, what superseded it).
export default defineApiHandler(async (event) => {
  await requireUser(event)
  const { id } = readParams(event, idParamSchema)
  const p = schema.profiles
  const [row] = await useDB().select({ profile: p, code: schema.airfields.code }).from(p)
    .innerJoin(schema.airfields, eq(schema.airfields.id, p.airfieldId)).where(eq(p.id, id))
  if (!row) throw createError({ statusCode: 404, statusMessage: `No profile ${id}` })
  const [levels, superseded] = await Promise.all([
    useDB().select().from(schema.profileLevels).where(eq(schema.profileLevels.profileId, id)).orderBy(asc(schema.profileLevels.seq)),
    useDB().select({ id: p.id }).from(p).where(eq(p.supersededById, id)),
  ])
  return { profile: publicProfile(row.profile, row.code, levels, superseded.map(s => s.id)) }
})

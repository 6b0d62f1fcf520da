import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { profileListQuerySchema } from '#shared/utils/profile-schema'
import { loadAirfield } from '../../../domain/airfields/lookup'
import { publicProfile } from '../../../domain/profiles/filing'

// The profiles of one airfield: filtered by a time range (validity overlapping it) and source, sorted, paged.
export default defineApiHandler(async (event) => {
  await requireUser(event)
  const { code } = readParams(event, airfieldCodeParamSchema)
  const query = readQuery(event, profileListQuerySchema)
  const { from, to, source, status, sort, order, page, pageSize } = query
  const airfield = await loadAirfield(code)
  const p = schema.profiles
  const where = and(
    eq(p.airfieldId, airfield.id),
    from ? gt(p.validTo, new Date(from)) : undefined,
    to ? lt(p.validFrom, new Date(to)) : undefined,
    source ? eq(p.source, source) : undefined,
    status ? eq(p.status, status) : undefined,
  )
  const column = { validFrom: p.validFrom, validTo: p.validTo, createdAt: p.createdAt, source: p.source, status: p.status }[sort]
  const dir = order === 'asc' ? asc : desc
  const [rows, [total]] = await Promise.all([
    useDB().select({
      profile: p,
      levelCount: sql<number>`(SELECT COUNT(*) FROM ${schema.profileLevels} WHERE ${schema.profileLevels.profileId} = ${p.id})`,
      filedBy: schema.users.email,
    }).from(p).leftJoin(schema.users, eq(schema.users.id, p.filedByUserId))
      .where(where).orderBy(dir(column), dir(p.id)).limit(pageSize).offset((page - 1) * pageSize),
    useDB().select({ n: sql<number>`COUNT(*)` }).from(p).where(where),
  ])
  return {
    airfieldCode: airfield.code,
    profiles: rows.map(({ profile, levelCount, filedBy }) => {
      const { levels: _levels, ...summary } = publicProfile(profile, airfield.code, [])
      return { ...summary, levelCount: Number(levelCount), filedBy, briefingUrl: `/briefings/${airfield.code}?profile=${profile.id}` }
    }),
    page, pageSize, total: Number(total?.n ?? 0),
  }
})

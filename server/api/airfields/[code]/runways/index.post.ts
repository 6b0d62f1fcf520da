import { airfieldCodeParamSchema, runwaySchema } from '#shared/utils/airfield-schema'
import { airfieldDetail, runwayEndValues } from '../../../../domain/airfields'
import { loadAirfield } from '../../../../domain/airfields/lookup'

export default defineApiHandler(async (event) => {
  const user = await requireCapability(event, 'manage-airfields')
  const { code } = readParams(event, airfieldCodeParamSchema)
  const body = await readBodyWith(event, runwaySchema)
  const airfield = await loadAirfield(code)
  const ends = runwayEndValues(airfield, body)
  try {
    const runway = await useDB().transaction(async (tx) => {
      const [row] = await tx.insert(schema.runways).values({ airfieldId: airfield.id, lengthM: body.lengthM ?? null }).$returningId()
      await tx.insert(schema.runwayEnds).values(ends.map(e => ({ ...e, runwayId: row!.id })))
      await recordAudit(tx, { user }, 'runway.create', 'runway', row!.id, {
        airfieldCode: airfield.code, ends: ends.map(e => ({ designator: e.designator, trueHeadingDeg: e.trueHeadingDeg, headingSource: e.headingSource })),
      })
      return row!.id
    })
    const detail = await airfieldDetail(airfield)
    setResponseStatus(event, 201)
    return { runway: detail.runways.find(r => r.id === runway), airfield: detail }
  }
  catch (err) {
    if (isDuplicateKeyError(err)) {
      throw createError({ statusCode: 409, statusMessage: `${airfield.code} already has a runway end ${ends.map(e => e.designator).join(' or ')}`, data: { issues: [{ field: 'ends[0].designator', message: 'already in use at this airfield' }] } })
    }
    throw err
  }
})

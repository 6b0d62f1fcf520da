import { windPreviewSchema } from '#shared/utils/profile-schema'
import { analyseProfile, WindValidationError } from '../../../shared/wind'
import { declinationToday } from '../../domain/airfields'
import { runwayEndInputsOf } from '../../domain/profiles/analysis'
import { loadAirfield } from '../../domain/airfields/lookup'
import { profileIssuesError, withLevelPlaces, zodProfileError } from '../../domain/profiles/filing'

// Runs the wind engine on levels without saving anything: for the entry form's live preview and for other systems.
export default defineApiHandler(async (event) => {
  if (getHeader(event, 'authorization') !== undefined) await requireFiler(event)
  else await requireUser(event)
  const body = await readLimitedJson(event)
  const parsed = windPreviewSchema.safeParse(body.value)
  if (!parsed.success) throw zodProfileError(parsed.error)
  const { levels, heightReference, airfield: code, runwayEnds, elevationM, qnhHpa, surfacePressureHpa } = parsed.data
  const pressures = { ...(qnhHpa === undefined ? {} : { qnhHpa }), ...(surfacePressureHpa === undefined ? {} : { surfacePressureHpa }) }
  let input
  let declination = null
  if (code) {
    const airfield = await loadAirfield(code)
    const ends = await useDB().select().from(schema.runwayEnds).where(eq(schema.runwayEnds.airfieldId, airfield.id))
    declination = declinationToday(airfield)
    input = { levels, heightReference, elevationM: airfield.elevationM, runwayEnds: runwayEndInputsOf(ends, declination?.declinationDeg ?? null), ...pressures }
  }
  else {
    input = { levels, heightReference, elevationM, runwayEnds: runwayEnds ?? [], ...pressures }
  }
  try {
    return { analysis: analyseProfile(input), declination }
  }
  catch (err) {
    if (err instanceof WindValidationError) throw profileIssuesError(withLevelPlaces(err.issues), 'The levels cannot be analysed')
    throw err
  }
})

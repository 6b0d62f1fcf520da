import type { ZodError } from 'zod'
import type { Airfield, Profile, ProfileLevel, User, ReportedWindShear } from '../../db/schema'
import { profileInputSchema, type ProfileEntryMethod, type ProfileInput, type ProfileLevelInput } from '#shared/utils/profile-schema'
import { analyseProfile, WindValidationError, WMM2025_END, WMM2025_START, type ValidationIssue, type WindWarning } from '../../../shared/wind'
import { airfieldDeclination, pressureInputsOf, runwayEndInputsOf } from './analysis'
import { and, eq, gt, inArray, lt, ne, schema, takeTurn } from '../../utils/db'
import type { Tx } from '../../utils/db'
import { recordAudit, type AuditActor } from '../../utils/audit'
import { evaluateAirfield } from '../alerts/evaluate'
import type { FieldIssue } from '../../utils/errors'
import { planSupersession, type Interval } from './supersession'
import { parseCodedLines } from './import/coded'
import { codedAgeLimits, codedReportWarnings } from './coded-check'

/** Who files: a signed-in person, or a feed with an API token acting for the person who made the token. */
export type FilingActor = { user: Pick<User, 'id' | 'email'>, token?: { id: number, name: string } | null }

/** Maps a level index to the line of the file it came from, so errors name the line. */
export type LineOf = (levelIndex: number) => number | undefined

export function auditActorOf(actor: FilingActor): AuditActor {
  return actor.token ? { label: `api-token:${actor.token.id} (${actor.token.name}) for ${actor.user.email}`, userId: actor.user.id } : { user: actor.user }
}

const LEVEL_PATH_RE = /^levels[.[](\d+)\]?\.?(.*)$/

/** Field issues with the level index (and the file line when known) taken out of the field path. */
export function withLevelPlaces(issues: { field: string, message: string, index?: number, line?: number }[], lineOf?: LineOf): FieldIssue[] {
  return issues.map((i) => {
    const m = LEVEL_PATH_RE.exec(i.field)
    const index = i.index ?? (m ? Number(m[1]) : undefined)
    const issue: FieldIssue = { field: i.field, message: i.message }
    if (index !== undefined) issue.index = index
    const line = i.line ?? (index !== undefined && lineOf ? lineOf(index) : undefined)
    if (line !== undefined) issue.line = line
    return issue
  })
}

export function profileIssuesError(issues: FieldIssue[], what = 'The profile was not filed') {
  const head = issues.slice(0, 3).map(i => `${i.line !== undefined ? `line ${i.line}: ` : ''}${i.field}: ${i.message}`).join('; ')
  return createError({
    statusCode: 422,
    statusMessage: `${what}: ${head}${issues.length > 3 ? ` (+${issues.length - 3} more)` : ''}`,
    data: { issues },
  })
}

export function zodProfileError(error: ZodError, lineOf?: LineOf) {
  return profileIssuesError(withLevelPlaces(error.issues.map(i => ({
    field: i.path.map((p, k) => (typeof p === 'number' ? `[${p}]` : `${k ? '.' : ''}${p}`)).join('') || '(body)',
    message: i.message,
  })), lineOf))
}

/** The profile as the API answers it (times in UTC with a Z). */
export function publicProfile(profile: Profile, airfieldCode: string, levels: ProfileLevel[] | ProfileLevelInput[], supersededIds: number[] = [],
  supersededPeriods: { from: string, to: string, byId: number }[] = []) {
  return {
    id: profile.id,
    airfieldCode,
    validFrom: profile.validFrom.toISOString(),
    validTo: profile.validTo.toISOString(),
    source: profile.source,
    heightReference: profile.heightReference,
    status: profile.status,
    notes: profile.notes,
    supersededIds,
    supersededById: profile.supersededById,
    supersededAt: profile.supersededAt?.toISOString() ?? null,
    // The parts of its validity newer profiles took over (supersession by time).
    supersededPeriods,
    qnhHpa: profile.qnhHpa ?? null,
    surfacePressureHpa: profile.surfacePressureHpa ?? null,
    rawReport: profile.rawReport ?? null,
    observedAt: profile.observedAt?.toISOString() ?? null,
    reportedWindShear: profile.reportedWindShear ?? null,
    withdrawnAt: profile.withdrawnAt?.toISOString() ?? null,
    withdrawnReason: profile.withdrawnReason,
    createdAt: profile.createdAt.toISOString(),
    entryMethod: profile.entry?.method ?? null,
    levels: levels.map(publicLevel),
  }
}

function publicLevel(l: ProfileLevel | ProfileLevelInput): ProfileLevelInput {
  const out: ProfileLevelInput = { directionDeg: l.directionDeg }
  for (const k of ['heightM', 'heightFt', 'pressureHpa', 'speedKt', 'speedMps', 'gustKt', 'gustMps', 'temperatureC'] as const) {
    const v = l[k]
    if (v !== undefined && v !== null) out[k] = v
  }
  return { ...pick(out, ['heightM', 'heightFt', 'pressureHpa']), directionDeg: out.directionDeg, ...pick(out, ['speedKt', 'speedMps', 'gustKt', 'gustMps', 'temperatureC']) }
}

function pick(o: ProfileLevelInput, keys: (keyof ProfileLevelInput)[]) {
  return Object.fromEntries(keys.filter(k => o[k] !== undefined).map(k => [k, o[k]]))
}

/**
 * Validates a profile against the airfield and the wind engine, without saving anything.
 * Throws a 422 whose data.issues are { field, message, index?, line? }.
 */
export function checkProfile(airfield: Airfield, runwayEnds: Parameters<typeof runwayEndInputsOf>[0], input: unknown, lineOf?: LineOf) {
  const parsed = profileInputSchema.safeParse(input)
  if (!parsed.success) throw zodProfileError(parsed.error, lineOf)
  const profile = parsed.data
  const validFrom = new Date(profile.validFrom)
  if (airfield.magVarOverrideDeg == null && (validFrom < WMM2025_START || validFrom > WMM2025_END)) {
    throw profileIssuesError([{ field: 'validFrom', message: 'must fall within the World Magnetic Model WMM2025 (2024-11-13 to 2029-11-13), or give the airfield a magnetic variation override' }])
  }
  const declination = airfieldDeclination(airfield, validFrom)
  try {
    const analysis = analyseProfile({
      levels: profile.levels,
      heightReference: profile.heightReference,
      elevationM: airfield.elevationM,
      runwayEnds: runwayEndInputsOf(runwayEnds, declination.declinationDeg),
      ...pressureInputsOf(profile, airfield),
    })
    return { profile, analysis, declination }
  }
  catch (err) {
    if (err instanceof WindValidationError) throw profileIssuesError(withLevelPlaces(err.issues as ValidationIssue[], lineOf))
    throw err
  }
}

function unitsOf(levels: ProfileLevelInput[]) {
  const first = levels[0]
  return {
    height: first?.heightFt !== undefined ? 'ft' : first?.pressureHpa !== undefined ? 'hPa' : 'm',
    speed: first?.speedMps !== undefined ? 'mps' : 'kt',
  }
}

export type FiledProfile = {
  profile: ReturnType<typeof publicProfile>
  warnings: WindWarning[]
  /** Alerts this filing's evaluation raised (notices sent: new crossings and reactivated ones; carried-over ones are not counted). */
  alertsRaised: number
}

/**
 * A coded-report profile: the lines are read again here, their station and age checked against the airfield;
 * a warning not confirmed refuses the filing. Returns the raw text and the runway wind shear to keep.
 */
function codedReportOf(airfield: Airfield, coded: { text: string, confirmWarnings?: boolean, period?: { line: number, index: number } }, now: Date) {
  const read = parseCodedLines(coded.text, now)
  if (read.issues.length) {
    throw profileIssuesError(read.issues.map(i => ({ field: `codedReport.text`, line: i.line, message: i.message })), 'The reports could not be read')
  }
  const warnings = codedReportWarnings(read.reports, { station: airfield.reportingStation ?? airfield.code, now, ...codedAgeLimits() })
  if (warnings.length && !coded.confirmWarnings) {
    throw profileIssuesError(warnings.map(w => ({ field: 'codedReport.confirmWarnings', line: w.line, message: `${w.message} Confirm to file anyway.` })), 'The reports need confirming')
  }
  // A profile for one TAF period keeps that period's runway wind shear only; otherwise every report's.
  let shearSources = read.reports.filter(r => r.runwayShear).map(r => ({ shear: r.runwayShear!, text: r.text, observedAt: r.observedAt }))
  if (coded.period) {
    const { line, index } = coded.period
    const report = read.reports.find(r => r.line === line)
    const period = report?.periods[index]
    if (!report || !period) throw profileIssuesError([{ field: 'codedReport.period', line, message: `Line ${line} has no period ${index + 1}` }], 'The reports could not be read')
    shearSources = period.runwayShear ? [{ shear: period.runwayShear, text: report.text, observedAt: report.observedAt }] : []
  }
  const reportedWindShear: ReportedWindShear | null = shearSources.length
    ? {
        allRunways: shearSources.some(r => r.shear.allRunways),
        runways: [...new Set(shearSources.flatMap(r => r.shear.runways))],
        groups: shearSources.flatMap(r => r.shear.groups),
        report: shearSources.map(r => r.text).join('\n').slice(0, 2000),
        observedAt: shearSources[0]!.observedAt,
      }
    : null
  const observed = read.reports.find(r => (r.kind === 'METAR' || r.kind === 'SPECI') && r.observedAt)?.observedAt
  return { rawReport: coded.text.trim(), reportedWindShear, observedAt: observed ? new Date(observed) : null, confirmed: warnings.map(w => w.message) }
}

/**
 * Files one profile in the caller's transaction: validates it, saves it and its levels, supersedes the active
 * profiles of the same airfield whose validity overlaps, records the audit entries and evaluates the airfield's
 * alerts once, inside the same transaction. Any error leaves nothing behind once the transaction rolls back.
 */
export async function fileProfile(tx: Tx, { airfield, input, actor, entryMethod, lineOf, details }: {
  airfield: Airfield
  input: unknown
  actor: FilingActor
  entryMethod: ProfileEntryMethod
  lineOf?: LineOf
  details?: Record<string, unknown>
}): Promise<FiledProfile> {
  // One filing at a time per airfield, so two overlapping filings cannot both stay active (a turn row: certified on
  // Galera, where a row lock alone would not keep two nodes apart).
  await takeTurn(tx, `airfield:${airfield.id}`)
  const ends = await tx.select().from(schema.runwayEnds).where(eq(schema.runwayEnds.airfieldId, airfield.id))
  const { profile: p, analysis } = checkProfile(airfield, ends, input, lineOf)
  const validFrom = new Date(p.validFrom)
  const validTo = new Date(p.validTo)
  const now = new Date()
  const coded = p.codedReport ? codedReportOf(airfield, p.codedReport, now) : null

  const [row] = await tx.insert(schema.profiles).values({
    airfieldId: airfield.id,
    validFrom,
    validTo,
    source: p.source,
    heightReference: p.heightReference,
    status: 'active',
    filedByUserId: actor.user.id,
    filedByTokenId: actor.token?.id ?? null,
    entry: { ...unitsOf(p.levels), method: entryMethod },
    notes: p.notes ?? null,
    qnhHpa: p.qnhHpa ?? null,
    surfacePressureHpa: p.surfacePressureHpa ?? null,
    rawReport: coded?.rawReport ?? null,
    observedAt: coded?.observedAt ?? null,
    reportedWindShear: coded?.reportedWindShear ?? null,
  }).$returningId()
  const profileId = row!.id
  await insertLevels(tx, profileId, p.levels)

  // Supersession by time: the new profile takes over only the time it shares with each active one.
  const overlapping = await tx.select({ id: schema.profiles.id, validFrom: schema.profiles.validFrom, validTo: schema.profiles.validTo })
    .from(schema.profiles).where(and(
      eq(schema.profiles.airfieldId, airfield.id),
      eq(schema.profiles.status, 'active'),
      ne(schema.profiles.id, profileId),
      lt(schema.profiles.validFrom, validTo),
      gt(schema.profiles.validTo, validFrom),
    )).for('update')
  const earlier = overlapping.length
    ? await tx.select().from(schema.profileSupersessions).where(inArray(schema.profileSupersessions.profileId, overlapping.map(o => o.id)))
    : []
  const plan = planSupersession(validFrom, validTo, overlapping.map(o => ({
    ...o, superseded: earlier.filter(e => e.profileId === o.id).map((e): Interval => ({ from: e.fromAt, to: e.toAt })),
  })), now)
  const supersededIds = plan.records.map(r => r.profileId)
  if (plan.records.length) {
    await tx.insert(schema.profileSupersessions).values(plan.records.map(r => ({ profileId: r.profileId, supersededById: profileId, fromAt: r.fromAt, toAt: r.toAt })))
  }
  if (plan.fullySuperseded.length) {
    await tx.update(schema.profiles).set({ status: 'superseded', supersededById: profileId, supersededAt: now })
      .where(and(inArray(schema.profiles.id, plan.fullySuperseded), eq(schema.profiles.status, 'active')))
  }

  const who = auditActorOf(actor)
  await recordAudit(tx, who, 'profile.file', 'profile', profileId, {
    airfieldCode: airfield.code, validFrom: validFrom.toISOString(), validTo: validTo.toISOString(), source: p.source,
    levels: p.levels.length, entryMethod, supersededIds, ...(actor.token ? { tokenId: actor.token.id } : {}), ...details,
    ...(coded ? { codedReport: true, confirmedWarnings: coded.confirmed } : {}),
  })
  for (const r of plan.records) {
    await recordAudit(tx, who, 'profile.supersede', 'profile', r.profileId, {
      airfieldCode: airfield.code, supersededById: profileId, from: r.fromAt.toISOString(), to: r.toAt.toISOString(),
      whole: plan.fullySuperseded.includes(r.profileId),
    })
  }

  // One evaluation of the airfield for the whole filing (new profile and the ones it superseded), with the analysis
  // made above.
  const evaluation = await evaluateAirfield(tx, airfield.id, { trigger: 'profile.file', actor: who, analyses: new Map([[profileId, analysis]]) })

  const [saved] = await tx.select().from(schema.profiles).where(eq(schema.profiles.id, profileId))
  return { profile: publicProfile(saved!, airfield.code, p.levels, supersededIds), warnings: analysis.warnings, alertsRaised: evaluation.raised.length }
}

async function insertLevels(tx: Tx, profileId: number, levels: ProfileInput['levels']) {
  const rows = levels.map((l, seq) => ({
    profileId, seq, directionDeg: l.directionDeg,
    heightM: l.heightM ?? null, heightFt: l.heightFt ?? null, pressureHpa: l.pressureHpa ?? null,
    speedKt: l.speedKt ?? null, speedMps: l.speedMps ?? null, gustKt: l.gustKt ?? null, gustMps: l.gustMps ?? null,
    temperatureC: l.temperatureC ?? null,
  }))
  // Batches keep each INSERT well under the server's packet limit at 5,000 levels.
  for (let i = 0; i < rows.length; i += 500) await tx.insert(schema.profileLevels).values(rows.slice(i, i + 500))
}

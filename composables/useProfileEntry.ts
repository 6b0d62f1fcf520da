import { toTypedSchema } from '@vee-validate/zod'
import { watchDebounced } from '@vueuse/core'
import { useFieldArray, useForm } from 'vee-validate'
import { profileInputSchema } from '#shared/utils/profile-schema'
import { M_PER_FT } from '#shared/units'

export type HeightKey = 'heightM' | 'heightFt' | 'pressureHpa'
export type SpeedKey = 'speedKt' | 'speedMps'
type LevelDraft = Record<string, number | undefined>
/** A period of a pasted TAF (opening conditions, FM, BECMG) with the levels it gives. */
export type CodedPeriodChoice = { group: string, from: string | null, to: string | null, levels: Record<string, number>[] }
/**
 * What the coded-report paste hands over: the text as pasted, the server's warnings, the reports' validity, and the
 * periods of the first TAF (filed one profile each in one step).
 */
export type CodedChoice = {
  text: string
  warnings: { line: number, message: string }[]
  validity: { validFrom: string, validTo: string } | null
  taf?: { line: number, periods: CodedPeriodChoice[] } | null
}
/** An active profile the one being entered would supersede, for the time they share ([from, to)). */
export type SupersedeChoice = { id: number, validFrom: string, validTo: string, from: string, to: string, whole: boolean }

const HEIGHT_LABEL: Record<HeightKey, string> = { heightM: 'm', heightFt: 'ft', pressureHpa: 'hPa' }
const gustKeyOf = (speed: SpeedKey) => (speed === 'speedKt' ? 'gustKt' : 'gustMps')

/** A level typed in one pair of units, carried over to another pair with its figures as typed. */
export function rekeyLevel(level: LevelDraft, from: { height: HeightKey, speed: SpeedKey }, to: { height: HeightKey, speed: SpeedKey }): LevelDraft {
  const out: LevelDraft = { directionDeg: level.directionDeg }
  out[to.height] = level[from.height]
  out[to.speed] = level[from.speed]
  const gust = level[gustKeyOf(from.speed)]
  if (gust !== undefined) out[gustKeyOf(to.speed)] = gust
  if (level.temperatureC !== undefined) out.temperatureC = level.temperatureC
  return out
}

/** Levels from the lowest up: heights ascending, pressures descending (pressure falls with height); blanks last. */
export function sortedLevels(levels: LevelDraft[], height: HeightKey): LevelDraft[] {
  const sign = height === 'pressureHpa' ? -1 : 1
  const key = (l: LevelDraft) => l[height] ?? Number.NaN
  return [...levels].sort((a, b) => {
    const x = key(a)
    const y = key(b)
    if (Number.isNaN(x) || Number.isNaN(y)) return Number.isNaN(x) ? (Number.isNaN(y) ? 0 : 1) : -1
    return sign * (x - y)
  })
}

/** Levels read from coded reports (heights in m or ft, speeds in kt) as table rows in m and kt. */
export function levelsFromCoded(levels: Record<string, number>[]): LevelDraft[] {
  return levels.map(l => ({
    heightM: l.heightM ?? Math.round((l.heightFt ?? 0) * M_PER_FT * 10) / 10,
    directionDeg: l.directionDeg,
    speedKt: l.speedKt,
    ...(l.gustKt === undefined ? {} : { gustKt: l.gustKt }),
  }))
}

/** The query of the airfield page after filing: its notice reads "Profile #N filed, supersedes #M, K alerts raised". */
export function filedNoticeQuery(res: { profile: { id: number, supersededIds: number[] }, alertsRaised: number }) {
  return { filed: String(res.profile.id), supersedes: res.profile.supersededIds.join(',') || undefined, alerts: String(res.alertsRaised) }
}

/** The same after filing one profile per TAF period: "Profiles #N1, #N2 filed, supersedes …, K alerts raised". */
export function filedPeriodsNoticeQuery(res: { profiles: { profile: { id: number, supersededIds: number[] } }[], alertsRaised: number }) {
  const filed = res.profiles.map(f => f.profile.id)
  const supersedes = [...new Set(res.profiles.flatMap(f => f.profile.supersededIds))].filter(id => !filed.includes(id))
  return { filed: filed.join(','), supersedes: supersedes.join(',') || undefined, alerts: String(res.alertsRaised) }
}

const heightKeyCm = (l: LevelDraft) => Math.round((l.heightM ?? (l.heightFt ?? 0) * M_PER_FT) * 100)

/**
 * The profile entry of an airfield: the form (the API's own schema), the level table in the units the dispatcher
 * picks, levels from coded reports, the live preview and filing. `now` fixes the default validity (this hour + 3 h).
 */
export function useProfileEntry(code: string, options: { now?: number, previewDebounceMs?: number } = {}) {
  const { $api } = useNuxtApp()
  const hour = Math.floor((options.now ?? Date.now()) / 3600_000) * 3600_000
  const iso = (ms: number) => new Date(ms).toISOString().replace('.000', '')
  const form = useForm({
    validationSchema: toTypedSchema(profileInputSchema),
    initialValues: {
      validFrom: iso(hour),
      validTo: iso(hour + 3 * 3600_000),
      source: 'wind-profiler' as const,
      heightReference: 'AGL' as const,
    },
  })
  type FormPath = Parameters<typeof form.setFieldError>[0]
  const { fields, push, remove, replace } = useFieldArray<LevelDraft>('levels')
  // Two levels to start with, blank cells until typed: the schema's "is required" messages name them.
  replace([{ heightM: 10 }, { heightM: 300 }])
  const [source] = form.defineField('source')
  const [heightReference] = form.defineField('heightReference')
  const [notes] = form.defineField('notes')
  const [validFrom] = form.defineField('validFrom')
  const [validTo] = form.defineField('validTo')
  const [qnhHpa] = form.defineField('qnhHpa')
  const [surfacePressureHpa] = form.defineField('surfacePressureHpa')
  /** QNH or station pressure as typed: blank leaves it out; anything else goes to the schema, whose message names it. */
  function setPressure(field: 'qnhHpa' | 'surfacePressureHpa', typed: string) {
    const raw = typed.trim().replace(',', '.')
    form.setFieldValue(field, raw === '' ? undefined : (Number.isFinite(Number(raw)) ? Number(raw) : raw as unknown as number))
  }
  function setTime(field: 'validFrom' | 'validTo', typed: string) {
    // Anything that is not a UTC time is passed on as typed, so the shared schema's message says what is wrong.
    form.setFieldValue(field, parseUtcText(typed) ?? typed.trim())
  }

  const units = reactive<{ height: HeightKey, speed: SpeedKey }>({ height: 'heightM', speed: 'speedKt' })
  const gustKey = computed(() => gustKeyOf(units.speed))
  const unitLabels = computed(() => ({ height: HEIGHT_LABEL[units.height], speed: units.speed === 'speedKt' ? 'kt' : 'm/s' }))
  const entry = ref<'table' | 'coded'>('table')
  watch(() => ({ ...units }), (now, before) => replace(fields.value.map(f => rekeyLevel(f.value, before, now))))

  function addLevel() {
    push({ [units.height]: undefined, directionDeg: undefined, [units.speed]: undefined })
  }
  // The coded reports the levels came from: kept with the profile; their warnings need confirming before filing.
  const coded = ref<CodedChoice | null>(null)
  const confirmCoded = ref(false)
  // The levels the reports gave (the rest of the table the dispatcher added).
  const codedLevels = ref<Record<string, number>[]>([])
  // The server refused the filing until the warnings are confirmed: the box with the tick is marked.
  const confirmAsked = ref(false)
  async function fromCoded(levels: Record<string, number>[], choice?: CodedChoice) {
    if (choice) {
      coded.value = choice
      confirmCoded.value = false
      form.setFieldValue('source', 'coded-report')
      form.setFieldValue('codedReport', { text: choice.text })
      if (choice.validity) {
        form.setFieldValue('validFrom', choice.validity.validFrom.replace('.000', ''))
        form.setFieldValue('validTo', choice.validity.validTo.replace('.000', ''))
      }
    }
    units.height = 'heightM'
    units.speed = 'speedKt'
    // Let the unit change re-key the old rows first, then put the coded levels in their place.
    await nextTick()
    codedLevels.value = levels
    replace(levelsFromCoded(levels))
    entry.value = 'coded'
  }

  // Before filing: which active profiles the validity as typed would supersede (asked again when it changes).
  const supersedes = ref<SupersedeChoice[] | null>(null)
  watchDebounced(() => [form.values.validFrom, form.values.validTo] as const, async ([from, to]) => {
    if (!from || !to || !(Date.parse(to) > Date.parse(from))) {
      supersedes.value = null
      return
    }
    try {
      supersedes.value = (await $api(`/api/airfields/${code}/profiles/supersedes`, { query: { validFrom: from, validTo: to } })).supersedes
    }
    catch {
      supersedes.value = null
    }
  }, { debounce: options.previewDebounceMs ?? 400, immediate: true })

  // The rows stay where they were typed (a row never moves under the cursor); the preview reads them in height order.
  const preview = useProfilePreview(code, () => ({
    heightReference: form.values.heightReference,
    levels: form.values.levels ? sortedLevels(form.values.levels as LevelDraft[], units.height) : undefined,
    qnhHpa: form.values.qnhHpa,
    surfacePressureHpa: form.values.surfacePressureHpa,
  }), { debounceMs: options.previewDebounceMs })

  /** Puts the rows in height order, as they will be filed: done when filing, so the server's row numbers match the table. */
  function sortRows() {
    const rows = fields.value.map(f => f.value)
    const sorted = sortedLevels(rows, units.height)
    if (sorted.some((r, i) => r !== rows[i])) replace(sorted)
  }

  const failure = ref('')
  const failureIssues = ref<{ field: string, message: string }[]>([])
  const file = form.handleSubmit(async (body) => {
    failure.value = ''
    failureIssues.value = []
    try {
      const codedReport = body.source === 'coded-report' && coded.value ? { text: coded.value.text, confirmWarnings: confirmCoded.value } : undefined
      const res = await $api(`/api/airfields/${code}/profiles`, { method: 'POST', query: { entry: entry.value }, body: { ...body, codedReport } })
      await navigateTo({ path: `/airfields/${code}`, query: filedNoticeQuery(res) })
    }
    catch (err) {
      const f = fetchFailure(err, 'The profile was not filed')
      // The server's message repeats its issues with their API paths: with issues, keep its first words and show
      // the issues themselves beside their fields.
      failure.value = f.issues.length ? f.message.split(': ')[0]! : f.message
      const confirm = f.issues.some(i => i.field === 'codedReport.confirmWarnings')
      confirmAsked.value = confirm
      if (confirm) failure.value = 'Not filed yet: the reports need confirming. Read the warnings above and tick the box to file them anyway'
      // Issues land beside their cells (`levels[1].directionDeg`); the rest are listed under the message.
      const known = new Set([...fields.value.flatMap((row, i) => Object.keys(row.value).map(k => `levels[${i}].${k}`)), 'validFrom', 'validTo', 'source', 'heightReference', 'notes', 'levels', 'codedReport', 'qnhHpa', 'surfacePressureHpa'])
      const isFormPath = (path: string): path is FormPath => known.has(path)
      failureIssues.value = f.issues.filter((issue) => {
        // The confirmation warnings are the ones listed in the box with the tick.
        if (issue.field === 'codedReport.confirmWarnings') return false
        const path = formPath(issue.field)
        if (!isFormPath(path)) return true
        form.setFieldError(path, issue.message)
        return false
      })
    }
  })
  async function submit() {
    sortRows()
    await nextTick()
    await file()
  }

  /**
   * Files one profile per period of the pasted TAF in one step (all or none): each period's own surface wind and WS
   * levels, with the levels the dispatcher added to the table (those not read from the reports) above them.
   */
  const filingPeriods = ref(false)
  async function filePeriods() {
    const taf = coded.value?.taf
    if (!taf) return
    failure.value = ''
    failureIssues.value = []
    filingPeriods.value = true
    try {
      const fromReports = new Set(levelsFromCoded(codedLevels.value).map(heightKeyCm))
      const levelsAloft = (form.values.levels as LevelDraft[] | undefined ?? [])
        .filter(l => !fromReports.has(heightKeyCm(l)))
        .map(l => Object.fromEntries(Object.entries(l).filter(([, v]) => v !== undefined && Number.isFinite(v))))
      const res = await $api(`/api/airfields/${code}/profiles/periods`, {
        method: 'POST',
        body: { text: coded.value!.text, line: taf.line, confirmWarnings: confirmCoded.value, levelsAloft, ...(form.values.notes ? { notes: form.values.notes } : {}) },
      })
      await navigateTo({ path: `/airfields/${code}`, query: filedPeriodsNoticeQuery(res) })
    }
    catch (err) {
      const f = fetchFailure(err, 'The periods were not filed')
      const confirm = f.issues.some(i => i.field === 'codedReport.confirmWarnings')
      confirmAsked.value = confirm
      failure.value = confirm ? 'Not filed yet: the reports need confirming. Read the warnings above and tick the box to file them anyway' : (f.issues.length ? f.message.split(': ')[0]! : f.message)
      failureIssues.value = f.issues.filter(i => i.field !== 'codedReport.confirmWarnings')
    }
    finally {
      filingPeriods.value = false
    }
  }
  const header = computed(() => ({ validFrom: form.values.validFrom, validTo: form.values.validTo, source: form.values.source, heightReference: form.values.heightReference, notes: form.values.notes }))

  return {
    errors: form.errors, values: form.values, isSubmitting: form.isSubmitting,
    fields, remove, source, heightReference, notes, validFrom, validTo, setTime, qnhHpa, surfacePressureHpa, setPressure,
    units, gustKey, unitLabels, entry, sortRows, addLevel, fromCoded, coded, confirmCoded, confirmAsked,
    preview, submit, failure, failureIssues, header, supersedes, filePeriods, filingPeriods,
  }
}

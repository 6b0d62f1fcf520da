// Figures the filing work (issue 11) adds to a runway end of the briefing answer: read only when the answer carries
// them, so the page shows them the day they arrive and shows nothing in their place before (no made-up values).

const num = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null)
const field = (o: unknown, key: string): unknown => (o !== null && typeof o === 'object' && key in o ? (o as Record<string, unknown>)[key] : undefined)

/** The largest 1 km averaged F-factor on arrival and departure, when the answer has one. */
export function fFactorOf(end: object): { arrival: number | null, departure: number | null } | null {
  const f = field(end, 'fFactor')
  if (f == null || typeof f !== 'object') return null
  const arrival = num(field(field(f, 'arrival'), 'maxF'))
  const departure = num(field(field(f, 'departure'), 'maxF'))
  return arrival == null && departure == null ? null : { arrival, departure }
}

/** The approach corridor's largest airspeed loss, when the answer has the corridor (else null: use the 0-600 m path). */
export function corridorLossOf(end: object): { lossKt: number, fromHeightM: number | null, toHeightM: number | null } | null {
  const c = field(end, 'arrivalCorridor')
  const lossKt = num(field(c, 'maxAirspeedLossKt'))
  if (lossKt == null) return null
  return { lossKt, fromHeightM: num(field(c, 'lossFromHeightM')), toHeightM: num(field(c, 'lossToHeightM')) }
}

/** "220°T/18G28 kt": the surface wind the way reports write it (ddd/ff, gust), in the reader's units; "calm" for calm. */
export function surfaceWindText(directionDeg: number, speedKt: number, gustKt: number | null | undefined, declinationDeg: number,
  ref: HeadingRef, unit: SpeedUnit): string {
  if (speedKt === 0 && !gustKt) return 'calm'
  const gust = gustKt ? `G${formatSpeed(gustKt, unit, false)}` : ''
  return `${formatHeading(directionDeg, declinationDeg, ref, speedKt === 0)}/${formatSpeed(speedKt, unit, false)}${gust} ${SPEED_UNIT_LABEL[unit]}`
}

/** A height with thousands grouped, "1,969 ft", "600 m" (labels; figures in tables stay plain). */
export function groupedHeight(heightM: number, unit: HeightUnit): string {
  return `${Math.round(heightFromM(heightM, unit)).toLocaleString('en-GB')} ${HEIGHT_UNIT_LABEL[unit]}`
}

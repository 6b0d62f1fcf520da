// Latitude and longitude as people write them: decimal degrees (signed, or with N/S/E/W), or degrees and minutes
// (and seconds) with N/S/E/W. 1° = 60′ = 3600″ (common practice). Pure; shared by the API schemas and the forms.

export type Axis = 'lat' | 'lon'

const HEMISPHERES: Record<Axis, { plus: string, minus: string }> = { lat: { plus: 'N', minus: 'S' }, lon: { plus: 'E', minus: 'W' } }

/** The form's example for each axis, shown when something else was typed. */
export const COORDINATE_EXAMPLES: Record<Axis, string> = {
  lat: 'decimal degrees (46.2083 or 46.2083 N; south negative) or degrees, minutes and seconds with N or S (46°12′30″N or 46 12 30 N)',
  lon: 'decimal degrees (7.3125 or 7.3125 E; west negative) or degrees, minutes and seconds with E or W (7°18′45″E or 7 18 45 E)',
}

/**
 * Degrees (north and east positive) from what was typed, or null when it is neither form. Numbers pass through.
 * Minutes and seconds must be below 60; a hemisphere letter and a minus sign together are refused.
 */
export function parseCoordinate(typed: unknown, axis: Axis): number | null {
  if (typeof typed === 'number') return Number.isFinite(typed) ? typed : null
  if (typeof typed !== 'string') return null
  let s = typed.trim().toUpperCase().replace(/,/g, '.')
  if (!s) return null
  const { plus, minus } = HEMISPHERES[axis]
  let sign = 1
  const letter = new RegExp(`^([${plus}${minus}])\\s*(.*)$|^(.*?)\\s*([${plus}${minus}])$`).exec(s)
  let hemisphere: string | null = null
  if (letter) {
    hemisphere = letter[1] ?? letter[4] ?? null
    s = (letter[2] ?? letter[3] ?? '').trim()
    if (hemisphere === minus) sign = -1
  }
  if (s.startsWith('-') || s.startsWith('+')) {
    if (hemisphere) return null
    if (s.startsWith('-')) sign = -1
    s = s.slice(1).trim()
  }
  // Degree, minute and second marks in their usual spellings become spaces.
  const parts = s.replace(/[°º˚]/g, ' ').replace(/['′’]/g, ' ').replace(/["″”]|''|′′/g, ' ').trim().split(/\s+/).filter(Boolean)
  if (!parts.length || parts.length > 3 || !parts.every(p => /^\d+(\.\d+)?$/.test(p))) return null
  // Only the last part may have a fraction; minutes and seconds need a hemisphere letter or a plain sign.
  if (parts.slice(0, -1).some(p => p.includes('.'))) return null
  const [d, m = '0', sec = '0'] = parts
  const deg = Number(d)
  const min = Number(m)
  const secs = Number(sec)
  if (min >= 60 || secs >= 60) return null
  return sign * (deg + min / 60 + secs / 3600)
}

/** For a schema's preprocess: a readable coordinate as its number, blank as missing, anything else as typed. */
export function coordinateOrTyped(typed: unknown, axis: Axis): unknown {
  if (typed === '' || typed === null || typed === undefined) return typed === '' ? undefined : typed
  const value = parseCoordinate(typed, axis)
  return value ?? typed
}

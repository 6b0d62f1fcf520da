const DEG = Math.PI / 180

export const degToRad = (deg: number): number => deg * DEG
export const radToDeg = (rad: number): number => rad / DEG

/** Map any finite angle into (0, 360]: north is 360, as in wind and runway conventions. */
export function normaliseHeadingDeg(deg: number): number {
  const r = deg % 360
  return r <= 0 ? r + 360 : r
}

/** Signed smallest difference b - a in (-180, 180]. */
export function signedAngleDiffDeg(aDeg: number, bDeg: number): number {
  let d = (bDeg - aDeg) % 360
  if (d > 180) d -= 360
  else if (d <= -180) d += 360
  return d
}

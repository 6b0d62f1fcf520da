import { degToRad, normaliseHeadingDeg, radToDeg } from './angles'
import type { UV, WindDirSpeed } from './types'

/** u (towards east) and v (towards north) from the direction the wind blows FROM and its speed (any unit). */
export function windToUV(directionDeg: number, speed: number): UV {
  const r = degToRad(directionDeg)
  return { u: -speed * Math.sin(r), v: -speed * Math.cos(r) }
}

/** Direction (0 for calm, otherwise (0, 360], 360 = north) and speed from u and v. */
export function uvToWind(u: number, v: number): WindDirSpeed {
  const speed = Math.hypot(u, v)
  if (speed === 0) return { directionDeg: 0, speed: 0 }
  return { directionDeg: normaliseHeadingDeg(radToDeg(Math.atan2(-u, -v))), speed }
}

/** Direction only, for hot loops (no object). */
export function uvToDirectionDeg(u: number, v: number): number {
  if (u === 0 && v === 0) return 0
  return normaliseHeadingDeg(radToDeg(Math.atan2(-u, -v)))
}

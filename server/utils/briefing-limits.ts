import { DEFAULT_LIMITS, type Limits } from './limits'

export type BriefingLimits = {
  limits: Limits
  limitsFor: (designator: string) => Limits
  /** 'default' here; where each figure comes from once the safety office's limit sets are in (per figure). */
  source: string | Record<string, string>
}

/**
 * The limits a briefing is held against. Until the safety office's limit sets exist this is the defaults;
 * when server/utils/thresholds.ts lands, the body becomes `return effectiveLimits(airfieldId)`.
 */
export async function briefingLimits(_airfieldId: number): Promise<BriefingLimits> {
  return { limits: DEFAULT_LIMITS, limitsFor: () => DEFAULT_LIMITS, source: 'default' }
}

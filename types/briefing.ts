// The briefing's shapes on the client, derived from what the route returns (Nitro's InternalApi holds each route's
// serialised return type), so a change on the server reaches every screen through the type checker.
import type { InternalApi } from 'nitropack/types'

// NonNullable: the route may also answer 304 with no body (ETag), which the pages never read as data.
type BriefingAnswer = NonNullable<InternalApi['/api/airfields/:code/briefing']['get']>

/** One briefing (the `briefing` of GET /api/airfields/{code}/briefing when a profile applies). */
export type BriefingView = NonNullable<BriefingAnswer['briefing']>
export type RunwayEndView = BriefingView['runwayEnds'][number]
export type LevelPoint = BriefingView['levels'][number]
export type EndLevel = RunwayEndView['levels'][number]
export type GridPoint = BriefingView['grid'][number]
export type FeetStep = BriefingView['feetSteps'][number]
export type LimitCheckView = RunwayEndView['checks'][number]
export type PathChangeView = NonNullable<RunwayEndView['arrival']>
export type ConvectiveView = BriefingView['convective']
export type ShearView = BriefingView['shear']

/** The day's trend at an airfield (GET /api/airfields/{code}/trend). */
export type TrendView = InternalApi['/api/airfields/:code/trend']['get']

/** The engine's answer for levels being entered (POST /api/wind/preview), nothing saved. */
export type WindPreviewView = InternalApi['/api/wind/preview']['post']
export type PreviewAnalysis = WindPreviewView['analysis']

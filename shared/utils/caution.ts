// The caution shown wherever a briefing, an alert or an export appears (pages, print, e-mail, push, exports).
export const VEERLINE_CAUTION = 'Advisory only. The official meteorological service\'s reports, forecasts and warnings, '
  + 'and ATC instructions and wind shear alerts, take precedence. The operator\'s procedures and local regulations decide.'

// The caution shown wherever a briefing, an alert or an export appears (pages, print, e-mail, push, exports).
export const VEERLINE_CAUTION = 'Advisory only. The official meteorological service\'s reports, forecasts and warnings, '
  + 'and ATC instructions and wind shear alerts, take precedence. The operator\'s procedures and local regulations decide.'

/** The caution in one line, for the top of a briefing (the full text stays at its foot and on paper). */
export const VEERLINE_CAUTION_SHORT = 'Advisory only: official reports, forecasts and warnings and ATC instructions come first; '
  + 'your operator\'s procedures decide.'

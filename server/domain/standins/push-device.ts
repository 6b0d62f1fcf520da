// Where the local push-service stand-in answers (scripts/standins/push.ts).
export const pushStandinUrl = () => process.env.VEERLINE_PUSH_STANDIN_URL || `http://127.0.0.1:${process.env.VEERLINE_PUSH_PORT || 8443}`

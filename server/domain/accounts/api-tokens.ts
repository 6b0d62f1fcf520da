import { createHash, randomBytes } from 'node:crypto'

export const API_TOKEN_PREFIX = 'vlt_'

export function sha256Hex(text: string | Buffer): string {
  return createHash('sha256').update(text).digest('hex')
}

/** A new random token (shown once) and what is stored of it. */
export function newApiToken() {
  const token = `${API_TOKEN_PREFIX}${randomBytes(24).toString('base64url')}`
  return { token, tokenHash: sha256Hex(token), tokenPrefix: token.slice(0, 10) }
}

import type { H3Event } from 'h3'
import { PROFILE_MAX_BYTES } from '#shared/utils/profile-schema'

/** The raw body as text, refused with 413 past `maxBytes` (checked on the header and on what arrived). */
export async function readLimitedText(event: H3Event, maxBytes = PROFILE_MAX_BYTES): Promise<string> {
  const tooLarge = () => createError({ statusCode: 413, statusMessage: `The request is larger than the limit of ${(maxBytes / 1024 / 1024).toFixed(0)} MB` })
  const declared = Number(getHeader(event, 'content-length') ?? '0')
  if (declared > maxBytes) throw tooLarge()
  const raw = await readRawBody(event, false)
  if (raw && raw.length > maxBytes) throw tooLarge()
  return raw ? raw.toString('utf8') : ''
}

/** The body parsed as JSON, 400 with the reason when it is not. */
export async function readLimitedJson(event: H3Event, maxBytes = PROFILE_MAX_BYTES): Promise<{ raw: string, value: unknown }> {
  const raw = await readLimitedText(event, maxBytes)
  try {
    return { raw, value: raw ? JSON.parse(raw) : undefined }
  }
  catch (err) {
    throw createError({ statusCode: 400, statusMessage: `The body is not valid JSON: ${(err as Error).message}` })
  }
}

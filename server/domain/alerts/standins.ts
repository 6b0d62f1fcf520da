// The local stand-ins for the hosted mail and push services exist only outside production.
export const standinsEnabled = (env: Record<string, string | undefined> = process.env) => env.NODE_ENV !== 'production'

const TOKEN_LINK = /\/(invite|reset)\/[A-Za-z0-9_-]{43}/g

/** Replaces the token of every invitation or reset link, so a mailbox reader cannot use someone else's link. */
export function maskTokenLinks(text: string): string {
  return text.replace(TOKEN_LINK, (_m, kind: string) => `/${kind}/(link hidden; an admin may reveal it)`)
}

// Sign-in checks that take the same work whether or not the e-mail has a usable account: an unknown, disabled or
// password-less account is verified against a dummy hash made once per process with the same hashing settings, so
// the answer's timing does not tell which addresses have accounts.
import { randomBytes } from 'node:crypto'

export type PasswordHasher = {
  hash: (password: string) => Promise<string>
  verify: (hash: string, password: string) => Promise<boolean>
}

let dummy: Promise<string> | undefined

/** The dummy hash: a random password nobody knows, hashed once (at start-up by server/plugins/security.ts). */
export function dummyPasswordHash(hasher: PasswordHasher): Promise<string> {
  dummy ??= hasher.hash(randomBytes(24).toString('base64url'))
  return dummy
}

/** True only for an enabled account with a password that matches; one verification in every case. */
export async function credentialsMatch(user: { passwordHash: string | null, disabled: boolean } | undefined,
  password: string, hasher: PasswordHasher): Promise<boolean> {
  const usable = Boolean(user?.passwordHash) && !user!.disabled
  const hash = usable ? user!.passwordHash! : await dummyPasswordHash(hasher)
  const matches = await hasher.verify(hash, password)
  return usable && matches
}

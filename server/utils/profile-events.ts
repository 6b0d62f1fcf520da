import type { Tx } from './db'

/**
 * What changed about the profiles of one airfield. Listeners (alert evaluation) run inside the same transaction
 * as the change, so a profile and the alerts it causes are saved together or not at all.
 */
export type ProfileChange = {
  kind: 'filed' | 'superseded' | 'withdrawn' | 'thresholds-changed'
  airfieldId: number
  profileId?: number
  actorUserId?: number | null
}

type Listener = (change: ProfileChange, tx: Tx) => Promise<void>
const listeners: Listener[] = []

export function onProfileChange(listener: Listener) {
  if (!listeners.includes(listener)) listeners.push(listener)
}

export async function emitProfileChange(tx: Tx, change: ProfileChange) {
  for (const listener of listeners) await listener(change, tx)
}

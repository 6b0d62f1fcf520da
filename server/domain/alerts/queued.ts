// Notices queued by this instance, counted, so the outbox worker can be woken once the write that queued them has
// been answered (its transaction committed) instead of waiting for its next poll. Other instances still find the rows
// by polling (VEERLINE_OUTBOX_INTERVAL_MS).
let queuedCount = 0

/** Called by enqueue (outbox.ts) inside the writing transaction. */
export function noticesQueued(n: number) {
  queuedCount += n
}

/** A mark to compare with later: has anything been queued since? */
export const queuedMark = () => queuedCount

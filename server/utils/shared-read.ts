/**
 * One database read shared by the requests that ask the same thing at the same moment. A read for `key` starts on
 * the next turn of the event loop, after every request that asked for it so far has arrived, and the key is free
 * again the moment it starts: a request that comes later waits for a read of its own. So every request is answered
 * from a read that began after it arrived, and sees whatever was committed before it came, on any instance (no
 * staleness at all, unlike a cache with a time to live), while 32 requests at once cost one query, not 32.
 * The value is shared: callers must not change it.
 */
const waiting = new Map<string, Promise<unknown>>()

export function sharedRead<T>(key: string, read: () => Promise<T>): Promise<T> {
  const pending = waiting.get(key)
  if (pending) return pending as Promise<T>
  const promise = new Promise<T>((resolve, reject) => {
    setImmediate(() => {
      waiting.delete(key)
      read().then(resolve, reject)
    })
  })
  waiting.set(key, promise)
  return promise
}

/** How many keys wait for their read to start (for tests and the health view; normally 0 between turns). */
export function sharedReadsWaiting() {
  return waiting.size
}

/**
 * Briefings of a profile version, computed once and kept in this instance's memory. The key is the profile id
 * and a stamp of everything the analysis and its limit checks depend on (the airfield's row, its runway ends,
 * the limit sets, the magnetic model and its date), read from the database in the same query as the profile, so
 * that an edit made on any instance changes the key and the next read recomputes. Bounded by entries and bytes;
 * the least recently used go first.
 */

export const CACHE_MAX_ENTRIES = Number(process.env.VEERLINE_BRIEFING_CACHE_ENTRIES) || 2000
export const CACHE_MAX_BYTES = Number(process.env.VEERLINE_BRIEFING_CACHE_BYTES) || 64 * 1024 * 1024

export class BoundedCache<V extends { bytes: number }> {
  private map = new Map<string, V>()
  private bytes = 0
  hits = 0
  misses = 0
  constructor(private maxEntries = CACHE_MAX_ENTRIES, private maxBytes = CACHE_MAX_BYTES) {}

  get(key: string): V | undefined {
    const v = this.map.get(key)
    if (v === undefined) {
      this.misses++
      return undefined
    }
    this.hits++
    // Most recently used last.
    this.map.delete(key)
    this.map.set(key, v)
    return v
  }

  /** The value without counting a hit or moving it up. */
  peek(key: string): V | undefined {
    return this.map.get(key)
  }

  set(key: string, value: V) {
    const old = this.map.get(key)
    if (old) {
      this.bytes -= old.bytes
      this.map.delete(key)
    }
    if (value.bytes > this.maxBytes) return
    this.map.set(key, value)
    this.bytes += value.bytes
    while (this.map.size > this.maxEntries || this.bytes > this.maxBytes) {
      const first = this.map.keys().next().value as string
      this.bytes -= this.map.get(first)!.bytes
      this.map.delete(first)
    }
  }

  get size() { return this.map.size }
  get totalBytes() { return this.bytes }
  clear() {
    this.map.clear()
    this.bytes = 0
  }
}

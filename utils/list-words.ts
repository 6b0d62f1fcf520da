/**
 * Where a page stands in its list, in words: "Airfields 25 to 48 of 203", or "7 airfields" when the list fits on one
 * page, or "No airfields to show". `page` counts from 1.
 */
export function listRangeWords(page: number, pageSize: number, shown: number, total: number, noun: string): string {
  if (!total || !shown) return `No ${noun}s to show`
  const count = (n: number) => n.toLocaleString('en-GB')
  if (shown >= total) return `${count(total)} ${total === 1 ? noun : `${noun}s`}`
  const first = (page - 1) * pageSize + 1
  const Noun = `${noun[0]!.toUpperCase()}${noun.slice(1)}`
  if (shown === 1) return `${Noun} ${count(first)} of ${count(total)}`
  return `${Noun}s ${count(first)} to ${count(first + shown - 1)} of ${count(total)}`
}

/**
 * Median for the engine's robust estimates: the upper middle value of an even-length list (no averaging, so it is
 * always one of the values), NaN for an empty list. The list is not modified.
 */
export function median(values: readonly number[]): number {
  const s = [...values].sort((a, b) => a - b)
  return s.length ? s[Math.floor(s.length / 2)] : NaN
}

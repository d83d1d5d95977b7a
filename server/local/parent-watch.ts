/**
 * Calls `onOrphaned` when the process that started us goes away (its pid changes to the reaper's), so stopping
 * `npm start` by any means, not only Ctrl-C, leaves nothing running. Only armed when the launcher asks for it.
 */
export function watchParent(onOrphaned: () => void): void {
  if (process.env.ROCKERBOOK_EXIT_WITH_PARENT !== '1') return
  const parent = process.ppid
  setInterval(() => {
    if (process.ppid !== parent) onOrphaned()
  }, 1_000).unref()
}

import { spawnSync } from 'node:child_process'
import { existsSync } from 'node:fs'
import { step } from './say'

export const chromiumPath = '/usr/bin/chromium'

/** The browser tests drive Debian's chromium; install the package when it is missing (never a downloaded browser). */
export function ensureChromium(): void {
  if (existsSync(chromiumPath)) return
  step('Installing Debian\'s chromium for the browser tests (apt-get; once, about 30 s)…')
  const sudo = process.getuid?.() === 0 ? [] : ['sudo']
  for (const argv of [[...sudo, 'apt-get', 'update', '-q'], [...sudo, 'env', 'DEBIAN_FRONTEND=noninteractive', 'apt-get', 'install', '-y', '-q', 'chromium']]) {
    const result = spawnSync(argv[0]!, argv.slice(1), { stdio: 'inherit' })
    if (result.status !== 0) throw new Error(`${argv.join(' ')} failed with exit code ${result.status}`)
  }
}

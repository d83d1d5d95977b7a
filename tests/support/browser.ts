import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { chromium, type BrowserContext } from 'playwright-core'

/**
 * Debian's chromium, headless, with a fresh profile. The flags keep it from calling home: this machine's network is
 * closed and chromium would otherwise retry background connections throughout the run.
 */
export async function launchBrowser(): Promise<BrowserContext & { dispose(): Promise<void> }> {
  const profileDir = mkdtempSync(join(tmpdir(), 'rockerbook-e2e-'))
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1280, height: 860 },
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  })
  return Object.assign(context, {
    async dispose() {
      await context.close()
      rmSync(profileDir, { recursive: true, force: true })
    },
  })
}

export function baseUrl(): string {
  const url = process.env.E2E_BASE_URL
  if (!url) throw new Error('Run the browser tests through `npm test`, which starts the app.')
  return url
}

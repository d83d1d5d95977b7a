// Plain JavaScript on purpose: this runs before `npm ci` has installed TypeScript tooling on a fresh clone.
import { spawn, spawnSync } from 'node:child_process'
import { createHash } from 'node:crypto'
import { existsSync, readFileSync, writeFileSync } from 'node:fs'
import { dirname, join, resolve } from 'node:path'
import { fileURLToPath } from 'node:url'

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..')
const stamp = join(root, 'node_modules', '.rockerbook-lock.sha256')

function lockHash() {
  return createHash('sha256').update(readFileSync(join(root, 'package-lock.json'))).digest('hex')
}

/** Runs `npm ci` only when node_modules is missing or was installed from a different package-lock.json. */
function ensurePackages() {
  const wanted = lockHash()
  if (existsSync(stamp) && readFileSync(stamp, 'utf8').trim() === wanted) return
  console.log('▸ Installing npm packages with `npm ci` (first run or package-lock.json changed; about a minute)…')
  const result = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root, stdio: 'inherit' })
  if (result.status !== 0) {
    console.error('✖ npm ci failed; see the messages above.')
    process.exit(result.status ?? 1)
  }
  writeFileSync(stamp, wanted)
}

/** Installs what is missing, then hands over to the TypeScript orchestrator for `mode` ('start' or 'test'). */
export function bootstrap(mode, extraArgs = []) {
  const startedAt = Date.now()
  ensurePackages()
  const child = spawn(process.execPath, ['--import', 'tsx', join(root, 'server/local/run.ts'), mode, ...extraArgs], {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, ROCKERBOOK_EXIT_WITH_PARENT: '1', ROCKERBOOK_STARTED_AT: String(startedAt) },
  })
  // If whatever started us dies without passing on a signal, stop the orchestrator rather than orphan it.
  const parent = process.ppid
  setInterval(() => {
    if (process.ppid !== parent) child.kill('SIGTERM')
  }, 1_000).unref()
  // Ctrl-C reaches the whole process group; the orchestrator does the orderly shutdown, we just wait for it.
  for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => child.kill(signal))
  child.on('exit', (code, signal) => process.exit(code ?? (signal ? 130 : 1)))
}

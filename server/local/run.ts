import type { ChildProcess } from 'node:child_process'
import { spawn, spawnSync } from 'node:child_process'
import { once } from 'node:events'
import { join } from 'node:path'
import { demoSignIns } from '../seeds/index'
import { ensureChromium, chromiumPath } from './chromium'
import { buildClientIfChanged } from './client-build'
import { prepareDatabase, seedDatabase, startServices } from './environment'
import { startNodeProcess, stopProcess, waitForHttp } from './processes'
import { profileFor, projectRoot, serviceEnv, type Mode } from './profiles'
import { watchParent } from './parent-watch'
import { done, step } from './say'

const mode = process.argv[2] as Mode
const extraArgs = process.argv.slice(3)
const profile = profileFor(mode)
// Measured from the moment `npm start` / `npm test` began, installs included.
const startedAt = Number(process.env.ROCKERBOOK_STARTED_AT ?? Date.now())
const children: ChildProcess[] = []
let services: { stop(): Promise<void> } | null = null

let shutdownDone: Promise<never> | null = null

/** Stops children, then services, once; a second signal while stopping waits for the first stop to finish. */
function shutdown(code: number): Promise<never> {
  shutdownDone ??= (async () => {
    if (mode === 'start') step('Stopping everything npm start started…')
    await Promise.all(children.map((c) => stopProcess(c)))
    await services?.stop()
    if (mode === 'start') done('Stopped')
    process.exit(code)
  })()
  return shutdownDone
}
process.on('SIGINT', () => void shutdown(0))
process.on('SIGTERM', () => void shutdown(0))
watchParent(() => void shutdown(1))

async function startApp(database: string, quiet: boolean): Promise<string> {
  const env = serviceEnv(profile, database)
  children.push(startNodeProcess('server/main.ts', env, 'server', quiet))
  children.push(startNodeProcess('workers/main.ts', env, 'worker', quiet))
  await waitForHttp(`${env.PUBLIC_URL}/api/health`)
  return env.PUBLIC_URL
}

async function runStart(): Promise<void> {
  services = await startServices(profile, { fresh: false })
  await prepareDatabase(profile, profile.database)
  buildClientIfChanged()
  const seeded = await seedDatabase(profile, profile.database)
  if (seeded.length) done(`Seeded demo data: ${seeded.join(', ')}`)
  const url = await startApp(profile.database, false)
  const seconds = ((Date.now() - startedAt) / 1000).toFixed(1)
  console.log(`\n✔ Rockerbook is running at ${url}  (ready in ${seconds} s)`)
  console.log(`  Mailbox for captured e-mail: ${url}/mailbox`)
  const signIns = demoSignIns()
  if (signIns.length) console.log(`  Demo sign-ins:\n${signIns.map((s) => `    ${s}`).join('\n')}`)
  console.log('  Press Ctrl-C to stop.\n')
}

/** The whole tree through vue-tsc, so a type error fails CI even where no test reaches it. */
function typecheck(): void {
  step('Type-checking client, server, workers and tests…')
  const result = spawnSync(process.execPath, [join(projectRoot, 'node_modules/vue-tsc/bin/vue-tsc.js'), '--noEmit', '-p', 'tsconfig.json'], {
    cwd: projectRoot,
    stdio: 'inherit',
  })
  if (result.status !== 0) throw new Error('Type errors: see above.')
}

async function runTests(): Promise<number> {
  services = await startServices(profile, { fresh: true })
  await prepareDatabase(profile, 'rockerbook_template')
  await prepareDatabase(profile, profile.database)
  buildClientIfChanged()
  ensureChromium()
  const url = await startApp(profile.database, true)
  if (!extraArgs.length) typecheck()
  step('Running the tests (unit, API, browser)…')
  const vitest = spawn(process.execPath, [join(projectRoot, 'node_modules/vitest/vitest.mjs'), 'run', ...extraArgs], {
    cwd: projectRoot,
    stdio: 'inherit',
    env: {
      ...process.env,
      ...serviceEnv(profile, 'rockerbook_template'),
      LOG_LEVEL: 'silent',
      TEST_PG_PORT: String(profile.pgPort),
      TEST_TEMPLATE_DATABASE: 'rockerbook_template',
      E2E_BASE_URL: url,
      E2E_DATABASE_URL: serviceEnv(profile).DATABASE_URL,
      CHROMIUM_PATH: chromiumPath,
    },
  })
  const [code] = (await once(vitest, 'exit')) as [number | null]
  const minutes = ((Date.now() - startedAt) / 60_000).toFixed(1)
  console.log(code === 0 ? `✔ All tests passed in ${minutes} min` : `✖ Tests failed (${minutes} min)`)
  return code ?? 1
}

try {
  if (mode === 'start') await runStart()
  else if (mode === 'test') await shutdown(await runTests())
  else throw new Error(`Unknown mode ${mode}: use start or test`)
} catch (error) {
  console.error(`✖ ${(error as Error).message}`)
  await shutdown(1)
}

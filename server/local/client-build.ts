import { spawnSync } from 'node:child_process'
import { createHash } from 'node:crypto'
import { existsSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs'
import { join, relative } from 'node:path'
import { projectRoot } from './profiles'
import { done, step } from './say'

const inputs = ['src', 'shared', 'index.html', 'vite.config.ts', 'package-lock.json', 'tsconfig.json']
const stampFile = join(projectRoot, 'dist', '.client-inputs.sha256')

function filesUnder(path: string): string[] {
  if (!existsSync(path)) return []
  if (!statSync(path).isDirectory()) return [path]
  return readdirSync(path).sort().flatMap((name) => filesUnder(join(path, name)))
}

/** A hash of every file the client build reads, so an unchanged client is not rebuilt. */
function inputsHash(): string {
  const hash = createHash('sha256')
  for (const file of inputs.flatMap((p) => filesUnder(join(projectRoot, p)))) {
    hash.update(relative(projectRoot, file)).update(readFileSync(file))
  }
  return hash.digest('hex')
}

export function buildClientIfChanged(): void {
  const wanted = inputsHash()
  const built = existsSync(join(projectRoot, 'dist/client/index.html'))
  if (built && existsSync(stampFile) && readFileSync(stampFile, 'utf8') === wanted) {
    done('Client is up to date (build skipped)')
    return
  }
  step('Building the client with Vite…')
  const result = spawnSync(process.execPath, [join(projectRoot, 'node_modules/vite/bin/vite.js'), 'build', '--logLevel', 'warn'], {
    cwd: projectRoot,
    stdio: 'inherit',
  })
  if (result.status !== 0) throw new Error('The client build failed; see the messages above.')
  writeFileSync(stampFile, wanted)
}

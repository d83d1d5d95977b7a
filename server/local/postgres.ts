import { execFileSync, spawnSync } from 'node:child_process'
import { chmodSync, chownSync, existsSync, mkdirSync, readdirSync } from 'node:fs'
import { join } from 'node:path'
import pg from 'pg'
import { step } from './say'

const isRoot = process.getuid?.() === 0

/** Finds Debian's PostgreSQL server binaries, installing the `postgresql` package when they are absent. */
export function ensurePostgresInstalled(): string {
  const found = findPgBin()
  if (found) return found
  step('Installing PostgreSQL from Debian packages (apt-get; once, about a minute)…')
  const sudo = isRoot ? [] : ['sudo']
  run([...sudo, 'apt-get', 'update', '-q'])
  run([...sudo, 'env', 'DEBIAN_FRONTEND=noninteractive', 'apt-get', 'install', '-y', '-q', 'postgresql'])
  stopPackageCluster()
  const bin = findPgBin()
  if (!bin) throw new Error('PostgreSQL was installed but its server binaries were not found under /usr/lib/postgresql.')
  return bin
}

function findPgBin(): string | null {
  const base = '/usr/lib/postgresql'
  if (!existsSync(base)) return null
  const versions = readdirSync(base).filter((v) => existsSync(join(base, v, 'bin/initdb'))).sort((a, b) => Number(b) - Number(a))
  return versions[0] ? join(base, versions[0], 'bin') : null
}

/** Debian's package starts a system-wide cluster on install; we run our own, so stop that one. */
function stopPackageCluster(): void {
  spawnSync('sh', ['-c', 'pg_lsclusters -h 2>/dev/null | while read v c rest; do pg_ctlcluster "$v" "$c" stop; done'], { stdio: 'ignore' })
}

function run(argv: string[]): void {
  const result = spawnSync(argv[0]!, argv.slice(1), { stdio: 'inherit' })
  if (result.status !== 0) throw new Error(`${argv.join(' ')} failed with exit code ${result.status}`)
}

/** Runs a PostgreSQL tool as the `postgres` system user when we are root: initdb refuses to run as root. */
function asDbUser(bin: string, tool: string, args: string[]): void {
  const argv = isRoot ? ['runuser', '-u', 'postgres', '--', join(bin, tool), ...args] : [join(bin, tool), ...args]
  execFileSync(argv[0]!, argv.slice(1), { stdio: ['ignore', 'ignore', 'inherit'] })
}

/** Creates the cluster on first use and starts it on 127.0.0.1 only; returns a function that stops it. */
export function startPostgres(bin: string, dataDir: string, port: number, serverOptions = ''): () => void {
  const pgData = join(dataDir, 'pg')
  mkdirSync(dataDir, { recursive: true })
  if (!existsSync(join(pgData, 'PG_VERSION'))) {
    step(`Creating a PostgreSQL cluster in ${pgData}`)
    mkdirSync(pgData, { recursive: true })
    chmodSync(pgData, 0o700)
    if (isRoot) chownSync(pgData, Number(execFileSync('id', ['-u', 'postgres']).toString()), Number(execFileSync('id', ['-g', 'postgres']).toString()))
    asDbUser(bin, 'initdb', ['-D', pgData, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8'])
  }
  step(`Starting PostgreSQL on 127.0.0.1:${port}`)
  // A cluster left running by a crashed earlier run is stopped first, so its settings are ours.
  spawnSync(isRoot ? 'runuser' : join(bin, 'pg_ctl'), isRoot ? ['-u', 'postgres', '--', join(bin, 'pg_ctl'), '-D', pgData, '-m', 'fast', '-w', 'stop'] : ['-D', pgData, '-m', 'fast', '-w', 'stop'], { stdio: 'ignore' })
  asDbUser(bin, 'pg_ctl', ['-D', pgData, '-l', join(pgData, 'server.log'), '-w', '-o', `-p ${port} -h 127.0.0.1 -k ${pgData} ${serverOptions}`, 'start'])
  return () => {
    // Ctrl-C may already have reached the postmaster and shut it down; that is fine.
    try {
      asDbUser(bin, 'pg_ctl', ['-D', pgData, '-m', 'fast', '-w', 'stop'])
    } catch {
      /* already stopped */
    }
  }
}

/** Creates `name` if missing, optionally as a copy of a template database. */
export async function ensureDatabase(port: number, name: string, options: { template?: string; recreate?: boolean } = {}): Promise<void> {
  const client = new pg.Client({ host: '127.0.0.1', port, user: 'postgres', database: 'postgres' })
  await client.connect()
  try {
    if (options.recreate) await client.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`)
    const { rowCount } = await client.query('SELECT 1 FROM pg_database WHERE datname = $1', [name])
    if (!rowCount) await client.query(`CREATE DATABASE "${name}"${options.template ? ` TEMPLATE "${options.template}"` : ''}`)
  } finally {
    await client.end()
  }
}

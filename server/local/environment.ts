import 'reflect-metadata'
import { rmSync } from 'node:fs'
import { loadConfig } from '../config/config'
import { closeContext, createContext } from '../context'
import { createDataSource } from '../db/data-source'
import { QueueService } from '../queue/queue.service'
import { StorageService } from '../services/storage.service'
import { assertPortsFree } from './ports'
import { ensureDatabase, ensurePostgresInstalled, startPostgres } from './postgres'
import { serviceEnv, type Profile } from './profiles'
import { startS3Fake } from './s3-fake'
import { step } from './say'
import { startSmtpFake } from './smtp-fake'

/** The embedded services of one profile, and how to stop them in reverse order. */
export interface LocalServices {
  stop(): Promise<void>
}

export async function startServices(profile: Profile, options: { fresh: boolean }): Promise<LocalServices> {
  await assertPortsFree({ PostgreSQL: profile.pgPort, 'S3 fake': profile.s3Port, 'SMTP fake': profile.smtpPort, app: profile.appPort })
  if (options.fresh) rmSync(profile.dataDir, { recursive: true, force: true })
  const stops: (() => unknown)[] = []
  const stop = async () => {
    for (const fn of stops.reverse()) await fn()
  }
  try {
    const bin = ensurePostgresInstalled()
    // Test clusters are thrown away after each run, so durability is traded for speed there.
    stops.push(startPostgres(bin, profile.dataDir, profile.pgPort, profile.mode === 'test' ? '-c fsync=off -c synchronous_commit=off' : ''))
    stops.push(await startS3Fake(profile.dataDir, profile.s3Port))
    stops.push(await startSmtpFake(profile.dataDir, profile.smtpPort))
    await new StorageService(loadConfig(serviceEnv(profile))).ensureBucket()
  } catch (error) {
    await stop()
    throw error
  }
  return { stop }
}

/** Creates the database if needed, applies pending migrations and installs the queue schema. */
export async function prepareDatabase(profile: Profile, database: string, options: { recreate?: boolean } = {}): Promise<void> {
  await ensureDatabase(profile.pgPort, database, options)
  const env = serviceEnv(profile, database)
  const db = createDataSource(env.DATABASE_URL)
  await db.initialize()
  try {
    const applied = await db.runMigrations({ transaction: 'each' })
    step(applied.length ? `Applied ${applied.length} migration(s) to ${database}` : `Database ${database} is up to date`)
  } finally {
    await db.destroy()
  }
  const queue = new QueueService(env.DATABASE_URL)
  await queue.start()
  await queue.stop()
}

/** Runs the demo seed steps not yet applied to `database`. */
export async function seedDatabase(profile: Profile, database: string): Promise<string[]> {
  const { runSeeds } = await import('../seeds/index')
  const ctx = await createContext(loadConfig({ ...serviceEnv(profile, database), LOG_LEVEL: 'warn' }), 'seed')
  try {
    return await runSeeds(ctx)
  } finally {
    await closeContext(ctx)
  }
}

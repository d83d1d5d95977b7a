import { resolve } from 'node:path'

export type Mode = 'start' | 'test'

/** Ports and folders of one local environment; dev and test never share a port or a data folder. */
export interface Profile {
  mode: Mode
  dataDir: string
  pgPort: number
  s3Port: number
  smtpPort: number
  appPort: number
  database: string
}

export const projectRoot = resolve(import.meta.dirname, '../..')

/**
 * `TEST_SLOT=n` gives a test run its own ports and data folder, so several test runs can share one machine
 * (developers running a single file while the full suite runs elsewhere).
 */
export function profileFor(mode: Mode, slot = Number(process.env.TEST_SLOT ?? 0)): Profile {
  if (mode === 'start') {
    return { mode, dataDir: resolve(projectRoot, '.data/dev'), pgPort: 55432, s3Port: 9410, smtpPort: 2587, appPort: 5180, database: 'rockerbook' }
  }
  const n = Number.isInteger(slot) && slot > 0 ? slot : 0
  return {
    mode,
    dataDir: resolve(projectRoot, n ? `.data/test-${n}` : '.data/test'),
    pgPort: 55442 + n * 10,
    s3Port: 9420 + n * 10,
    smtpPort: 2597 + n * 10,
    appPort: 5190 + n * 10,
    database: 'rockerbook_e2e',
  }
}

/** The environment the server, the worker and the tests get, pointing at this profile's embedded services. */
export function serviceEnv(profile: Profile, database = profile.database): Record<string, string> {
  const url = `http://127.0.0.1:${profile.appPort}`
  return {
    NODE_ENV: profile.mode === 'start' ? 'development' : 'test',
    PORT: String(profile.appPort),
    HOST: '127.0.0.1',
    PUBLIC_URL: url,
    DATABASE_URL: `postgres://postgres@127.0.0.1:${profile.pgPort}/${database}`,
    S3_ENDPOINT: `http://127.0.0.1:${profile.s3Port}`,
    S3_BUCKET: 'rockerbook',
    S3_ACCESS_KEY: 'S3RVER',
    S3_SECRET_KEY: 'S3RVER',
    SMTP_URL: `smtp://127.0.0.1:${profile.smtpPort}`,
    DEV_MAILBOX_DIR: resolve(profile.dataDir, 'mail'),
    CLIENT_DIST: resolve(projectRoot, 'dist/client'),
  }
}

import 'reflect-metadata'
import { randomBytes } from 'node:crypto'
import pg from 'pg'
import { loadConfig } from '../../server/config/config'
import { closeContext, createContext, type AppContext } from '../../server/context'

/**
 * A context on a private copy of the migrated template database, so each test file starts from the same empty
 * schema and no test depends on another's rows. Storage and mail are the real local fakes `npm test` started.
 */
export async function createTestContext(): Promise<AppContext & { dispose(): Promise<void> }> {
  const port = Number(process.env.TEST_PG_PORT)
  const template = process.env.TEST_TEMPLATE_DATABASE
  if (!port || !template) throw new Error('Run the API tests through `npm test`, which starts the test services.')
  const name = `test_${randomBytes(6).toString('hex')}`
  await adminQuery(port, `CREATE DATABASE "${name}" TEMPLATE "${template}"`)
  const config = loadConfig({
    ...process.env,
    DATABASE_URL: `postgres://postgres@127.0.0.1:${port}/${name}`,
    LOG_LEVEL: 'silent',
  })
  const ctx = await createContext(config, 'test')
  return {
    ...ctx,
    async dispose() {
      await closeContext(ctx)
      await adminQuery(port, `DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`)
    },
  }
}

async function adminQuery(port: number, sql: string): Promise<void> {
  const client = new pg.Client({ host: '127.0.0.1', port, user: 'postgres', database: 'postgres' })
  await client.connect()
  try {
    await client.query(sql)
  } finally {
    await client.end()
  }
}

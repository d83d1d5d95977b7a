import 'reflect-metadata'
import { once } from 'node:events'
import { createApp } from './app'
import { loadConfig } from './config/config'
import { closeContext, createContext } from './context'
import { watchParent } from './local/parent-watch'

const config = loadConfig()
const ctx = await createContext(config, 'server')
await ctx.storage.ensureBucket()
const server = createApp(ctx).listen(config.PORT, config.HOST)
await once(server, 'listening')
ctx.logger.info({ url: config.PUBLIC_URL }, 'server listening')

async function shutdown(signal: string): Promise<void> {
  ctx.logger.info({ signal }, 'server stopping')
  server.close()
  server.closeAllConnections()
  await closeContext(ctx)
  process.exit(0)
}
process.once('SIGINT', () => void shutdown('SIGINT'))
process.once('SIGTERM', () => void shutdown('SIGTERM'))
watchParent(() => void shutdown('parent exited'))

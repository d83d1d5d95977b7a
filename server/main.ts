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

let stopping = false
async function shutdown(signal: string): Promise<void> {
  // Ctrl-C reaches this process directly and again through the launcher: stop once.
  if (stopping) return
  stopping = true
  ctx.logger.info({ signal }, 'server stopping')
  server.close()
  server.closeAllConnections()
  await closeContext(ctx)
  process.exit(0)
}
process.on('SIGINT', () => void shutdown('SIGINT'))
process.on('SIGTERM', () => void shutdown('SIGTERM'))
watchParent(() => void shutdown('parent exited'))

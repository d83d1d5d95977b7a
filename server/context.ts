import type { Logger } from 'pino'
import type { DataSource } from 'typeorm'
import type { AppConfig } from './config/config'
import { createDataSource } from './db/data-source'
import { createLogger } from './logger'
import { QueueService } from './queue/queue.service'
import { MailService } from './services/mail.service'
import { StorageService } from './services/storage.service'

/** Everything a route, a service or a job needs from the outside world, built once per process. */
export interface AppContext {
  config: AppConfig
  logger: Logger
  db: DataSource
  storage: StorageService
  mail: MailService
  queue: QueueService
}

export async function createContext(config: AppConfig, processName: string): Promise<AppContext> {
  const logger = createLogger(config.LOG_LEVEL, processName)
  const db = createDataSource(config.DATABASE_URL)
  await db.initialize()
  const queue = new QueueService(config.DATABASE_URL, { onError: (err) => logger.error({ err }, 'job queue error') })
  await queue.start()
  return {
    config,
    logger,
    db,
    storage: new StorageService(config),
    mail: new MailService(config),
    queue,
  }
}

export async function closeContext(ctx: AppContext): Promise<void> {
  await ctx.queue.stop()
  await ctx.mail.close()
  await ctx.db.destroy()
}

import 'reflect-metadata'
import { loadConfig } from '../server/config/config'
import { closeContext, createContext } from '../server/context'
import { watchParent } from '../server/local/parent-watch'
import type { JobDefinition } from './job'
import { checkRegistry, jobs } from './registry'

checkRegistry()
const ctx = await createContext(loadConfig(), 'worker')

async function register(job: JobDefinition<any>): Promise<void> {
  const log = ctx.logger.child({ job: job.name })
  const handler = async ([item]: { id: string; data: unknown }[]) => {
    if (!item) return
    const started = performance.now()
    const outcome = await job.handle(ctx, job.payload.parse(item.data))
    log.info({ jobId: item.id, outcome, ms: Math.round(performance.now() - started) }, 'job finished')
    return { outcome }
  }
  // pg-boss 10 runs one fetch loop per work() call: start several for jobs that may run side by side.
  for (let i = 0; i < (job.concurrency ?? 1); i++) {
    await ctx.queue.boss.work(job.name, { batchSize: 1, pollingIntervalSeconds: 1 }, handler)
  }
}

for (const job of jobs) await register(job)
ctx.logger.info({ jobs: jobs.map((j) => j.name) }, 'worker ready')

let stopping = false
async function shutdown(signal: string): Promise<void> {
  // Ctrl-C reaches this process directly and again through the launcher: stop once.
  if (stopping) return
  stopping = true
  ctx.logger.info({ signal }, 'worker stopping')
  await closeContext(ctx)
  process.exit(0)
}
process.on('SIGINT', () => void shutdown('SIGINT'))
process.on('SIGTERM', () => void shutdown('SIGTERM'))
watchParent(() => void shutdown('parent exited'))

import PgBoss from 'pg-boss'
import { jobNames, jobPayloads, type JobName, type JobPayload } from '../../shared/schemas/jobs'

/**
 * Retry, backoff and expiry live here, in one place. A job whose worker dies is expired after `expireInSeconds`
 * and retried by the queue's maintenance, so nothing is lost when a worker process is killed mid-job.
 */
export const queuePolicy = {
  retryLimit: 5,
  retryDelay: 5,
  retryBackoff: true,
  expireInSeconds: 180,
} as const

/** The job queue kept in PostgreSQL (schema `pgboss`), shared by every server and worker process. */
export class QueueService {
  readonly boss: PgBoss

  constructor(
    databaseUrl: string,
    options: { maintenanceIntervalSeconds?: number; onError?: (err: unknown) => void } = {},
  ) {
    this.boss = new PgBoss({
      connectionString: databaseUrl,
      max: 4,
      maintenanceIntervalSeconds: options.maintenanceIntervalSeconds ?? 30,
      monitorStateIntervalSeconds: 60,
    })
    // pg-boss re-emits its pool's errors (a dropped connection, a database restarting) as 'error'; an emitter with no
    // listener turns that into an uncaught exception that would take the whole process down.
    const onError = options.onError ?? ((err: unknown) => console.error('job queue error', err))
    this.boss.on('error', onError)
  }

  /** Installs or migrates the queue schema and creates every named queue (pg-boss 10 requires it before use). */
  async start(): Promise<void> {
    await this.boss.start()
    for (const name of jobNames) await this.boss.createQueue(name, { name, ...queuePolicy })
  }

  async send<N extends JobName>(name: N, payload: JobPayload<N>, options: { singletonKey?: string } = {}): Promise<string | null> {
    const data = jobPayloads[name].parse(payload)
    return this.boss.send(name, data, { ...queuePolicy, ...options })
  }

  async ping(): Promise<void> {
    if (!(await this.boss.isInstalled())) throw new Error('queue schema is not installed')
  }

  /** Lets running jobs finish (up to 10 s), then closes the queue's connections before resolving. */
  async stop(): Promise<void> {
    await this.boss.stop({ graceful: true, wait: true, timeout: 10_000 })
  }
}

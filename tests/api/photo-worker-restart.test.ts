import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { QueueService } from '../../server/queue/queue.service'
import { measurablePhoto } from '../factories/photos'
import { skaterWithPair } from '../factories/records'
import { signedInAs } from '../support/accounts'
import { createTestContext } from '../support/test-context'
import { startWorker, type WorkerProcess } from '../support/worker-process'
import { waitForAnalysis } from '../support/analyses'

async function until<T>(what: string, fn: () => Promise<T | undefined>, timeoutMs: number, everyMs = 20): Promise<T> {
  const deadline = Date.now() + timeoutMs
  for (;;) {
    const value = await fn()
    if (value !== undefined) return value
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`)
    await new Promise((r) => setTimeout(r, everyMs))
  }
}

describe('a worker killed mid-job', () => {
  let ctx: Awaited<ReturnType<typeof createTestContext>>
  let maintenance: QueueService
  const workers: WorkerProcess[] = []

  beforeAll(async () => {
    ctx = await createTestContext()
    // A second queue client that runs the queue's maintenance every second, as a deployment with a short interval does.
    maintenance = new QueueService(ctx.config.DATABASE_URL, { maintenanceIntervalSeconds: 1 })
    await maintenance.start()
  })
  afterAll(async () => {
    for (const w of workers) await w.stop('SIGKILL')
    await maintenance?.stop()
    await ctx?.dispose()
  })

  it('is taken up again after the job expires and ends measured, once', async () => {
    const app = createApp(ctx)
    // 12 MP so the analysis runs long enough to be caught running.
    const [photo, first] = await Promise.all([measurablePhoto({ resolution: '12mp' }), startWorker(ctx)])
    workers.push(first)
    const owner = await signedInAs(app, ctx, ['skater'])
    const ids = await skaterWithPair(owner.client, { sizeIn: photo.scene.blade.nominalSizeIn, discipline: 'freestyle' })
    const res = await owner.client.post(`/api/blades/${ids.leftId}/photos`).attach('photo', photo.jpeg, 'blade.jpg').expect(202)
    const id = res.body.analysisId as string

    await until('the analysis to run', async () => {
      const [row] = await ctx.db.query(`SELECT status FROM analyses WHERE id = $1`, [id])
      return row.status === 'running' ? true : undefined
    }, 60_000)
    await first.stop('SIGKILL')
    const [killed] = await ctx.db.query(`SELECT status, attempts FROM analyses WHERE id = $1`, [id])
    expect(killed).toEqual({ status: 'running', attempts: 1 })

    // Let the job's expiry pass without waiting minutes: move its start back past expire_in.
    await ctx.db.query(
      `UPDATE pgboss.job SET started_on = now() - expire_in - interval '1 second' WHERE name = 'photo.analyze' AND state = 'active'`)
    await until('the queue to put the job up for retry', async () => {
      const [job] = await ctx.db.query(`SELECT state FROM pgboss.job WHERE name = 'photo.analyze' AND singleton_key = $1`, [id])
      return job.state === 'retry' ? true : undefined
    }, 30_000, 250)

    workers.push(await startWorker(ctx))
    const done = await waitForAnalysis(owner.client, id, ['measured', 'refused', 'failed'], 120_000)
    expect(done.status).toBe('measured')
    const [row] = await ctx.db.query(`SELECT attempts FROM analyses WHERE id = $1`, [id])
    expect(row.attempts).toBe(2)
    const counts = await ctx.db.query(
      `SELECT (SELECT count(*)::int FROM analyses) AS analyses, (SELECT count(*)::int FROM photos) AS photos,
              (SELECT count(*)::int FROM pgboss.job WHERE name = 'photo.analyze') AS jobs,
              (SELECT count(*)::int FROM pgboss.job WHERE name = 'photo.analyze' AND state = 'completed') AS completed`)
    expect(counts[0]).toEqual({ analyses: 1, photos: 1, jobs: 1, completed: 1 })
  }, 600_000)
})

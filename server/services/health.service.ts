import type { AppContext } from '../context'
import type { Health, ServiceHealth } from '../../shared/schemas/health'

const CHECK_TIMEOUT_MS = 3_000

async function timed(check: () => Promise<unknown>): Promise<ServiceHealth> {
  const started = performance.now()
  let timer: NodeJS.Timeout | undefined
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`no answer within ${CHECK_TIMEOUT_MS} ms`)), CHECK_TIMEOUT_MS)
  })
  try {
    await Promise.race([check(), timeout])
    return { status: 'up', latencyMs: Math.round(performance.now() - started) }
  } catch (error) {
    return { status: 'down', latencyMs: Math.round(performance.now() - started), message: (error as Error).message }
  } finally {
    clearTimeout(timer)
  }
}

/** Checks every backing service in parallel; the whole is up only when each part is. */
export async function checkHealth(ctx: AppContext): Promise<Health> {
  const [database, storage, mail, queue] = await Promise.all([
    timed(() => ctx.db.query('SELECT 1')),
    timed(() => ctx.storage.ping()),
    timed(() => ctx.mail.ping()),
    timed(() => ctx.queue.ping()),
  ])
  const services = { database, storage, mail, queue }
  const status: Health['status'] = Object.values(services).every((s) => s.status === 'up') ? 'up' : 'down'
  return { status, services }
}

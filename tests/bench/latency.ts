/**
 * Upload → result latency on this machine: the real server and worker processes on fresh local services, one
 * generated 12 MP photo per upload, timed from the start of the upload until the analysis reads measured (or
 * refused), at 1 and at 8 concurrent uploads. Prints p50 and p95 per level. `TEST_SLOT` picks the ports (default 9).
 */
import 'reflect-metadata'
import { closeContext, createContext } from '../../server/context'
import { loadConfig } from '../../server/config/config'
import { prepareDatabase, startServices } from '../../server/local/environment'
import { startNodeProcess, stopProcess, waitForHttp } from '../../server/local/processes'
import { profileFor, serviceEnv } from '../../server/local/profiles'
import { createAccount } from '../../server/services/auth.service'
import { generatedPhoto } from '../factories/photos'

const PASSWORD = 'bench password for latency'
const SEEDS = [1, 2, 3, 4, 5, 6, 7, 8]
const SEQUENTIAL_RUNS = 6
const CONCURRENT_BATCHES = 2

interface Run { ms: number; status: string; workerMs: number }

function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b)
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]
}

async function signedInCookie(base: string, databaseUrl: string): Promise<string> {
  const ctx = await createContext(loadConfig({ ...process.env, DATABASE_URL: databaseUrl, LOG_LEVEL: 'silent' }), 'bench')
  const email = `bench-${Date.now()}@example.test`
  await createAccount(ctx, { email, password: PASSWORD, name: 'Bench Skater', roles: ['skater'], verified: true })
  await closeContext(ctx)
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST', headers: { 'Content-Type': 'application/json', Origin: base }, body: JSON.stringify({ email, password: PASSWORD }),
  })
  if (!res.ok) throw new Error(`sign-in answered ${res.status}`)
  return res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ')
}

function client(base: string, cookie: string) {
  const headers = { Cookie: cookie, Origin: base }
  return {
    async json<T>(method: string, path: string, body?: unknown): Promise<T> {
      const res = await fetch(`${base}/api${path}`, {
        method, headers: { ...headers, 'Content-Type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body),
      })
      if (!res.ok) throw new Error(`${method} ${path} answered ${res.status}: ${await res.text()}`)
      return (await res.json()) as T
    },
    /** Uploads one photo and polls until the analysis ends; returns the elapsed ms and the final status. */
    async uploadAndWait(bladeId: string, jpeg: Buffer): Promise<Run> {
      const started = performance.now()
      const form = new FormData()
      form.append('photo', new Blob([new Uint8Array(jpeg)], { type: 'image/jpeg' }), 'blade.jpg')
      const res = await fetch(`${base}/api/blades/${bladeId}/photos`, { method: 'POST', headers, body: form })
      if (res.status !== 202) throw new Error(`upload answered ${res.status}: ${await res.text()}`)
      const { analysisId } = (await res.json()) as { analysisId: string }
      for (;;) {
        const a = await this.json<{ status: string; durationMs: number | null }>('GET', `/analyses/${analysisId}`)
        if (!['queued', 'running'].includes(a.status)) return { ms: performance.now() - started, status: a.status, workerMs: a.durationMs ?? 0 }
        await new Promise((r) => setTimeout(r, 100))
      }
    },
  }
}

async function measure(label: string, runs: () => Promise<Run[]>) {
  const results = await runs()
  const ms = results.map((r) => r.ms)
  const worker = results.map((r) => r.workerMs)
  const statuses = results.reduce<Record<string, number>>((acc, r) => ({ ...acc, [r.status]: (acc[r.status] ?? 0) + 1 }), {})
  console.log(`${label.padEnd(26)} n=${String(ms.length).padStart(2)}  p50 ${(percentile(ms, 50) / 1000).toFixed(2)} s  p95 ${(percentile(ms, 95) / 1000).toFixed(2)} s  (in the worker: p50 ${(percentile(worker, 50) / 1000).toFixed(2)} s)  ${JSON.stringify(statuses)}`)
}

async function main(): Promise<void> {
  const profile = profileFor('test', Number(process.env.TEST_SLOT ?? 9) || 9)
  const services = await startServices(profile, { fresh: true })
  const children: ReturnType<typeof startNodeProcess>[] = []
  try {
    await prepareDatabase(profile, profile.database)
    const env: Record<string, string> = { ...serviceEnv(profile), LOG_LEVEL: 'warn' }
    children.push(startNodeProcess('server/main.ts', env, 'server', true), startNodeProcess('workers/main.ts', env, 'worker', true))
    console.error('Rendering 12 MP test photos…')
    const photos: Awaited<ReturnType<typeof generatedPhoto>>[] = []
    for (const seed of SEEDS) photos.push(await generatedPhoto(seed, { resolution: '12mp', discipline: 'freestyle' }))
    await waitForHttp(`${env.PUBLIC_URL}/api/health`)
    const api = client(env.PUBLIC_URL, await signedInCookie(env.PUBLIC_URL, env.DATABASE_URL))
    const skater = await api.json<{ id: string }>('POST', '/skaters', { name: 'Bench' })
    const pair = await api.json<{ blades: { id: string }[] }>('POST', `/skaters/${skater.id}/pairs`, { label: 'Bench pair', sizeIn: 9.5, discipline: 'freestyle' })
    const blade = pair.blades[0].id
    // One warm-up so the worker has loaded OpenCV before anything is timed.
    await api.uploadAndWait(blade, photos[0].jpeg)
    console.log('\nUpload → result latency (12 MP JPEG, one worker process, this machine)')
    await measure('1 upload at a time', async () => {
      const out = []
      for (let i = 0; i < SEQUENTIAL_RUNS; i++) out.push(await api.uploadAndWait(blade, photos[i % photos.length].jpeg))
      return out
    })
    await measure('8 concurrent uploads', async () => {
      const out = []
      for (let b = 0; b < CONCURRENT_BATCHES; b++) out.push(...(await Promise.all(photos.map((p) => api.uploadAndWait(blade, p.jpeg)))))
      return out
    })
  } finally {
    await Promise.all(children.map((c) => stopProcess(c)))
    await services.stop()
  }
}

main().then(() => process.exit(0), (error: unknown) => {
  console.error(error)
  process.exit(1)
})

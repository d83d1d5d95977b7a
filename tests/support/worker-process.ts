import { spawn, type ChildProcess } from 'node:child_process'
import { once } from 'node:events'
import { join } from 'node:path'
import type { AppContext } from '../../server/context'

const root = join(import.meta.dirname, '../..')

export interface WorkerProcess {
  child: ChildProcess
  /** Lines the worker logged (pino JSON), newest last. */
  lines: string[]
  stop(signal?: NodeJS.Signals): Promise<void>
}

/**
 * The real worker entry point (`workers/main.ts`) as a child process on the test's private database, so API tests
 * exercise the queue, the job and the engine exactly as `npm start` runs them, and can kill it mid-job.
 */
export async function startWorker(ctx: AppContext, timeoutMs = 60_000): Promise<WorkerProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', join(root, 'workers/main.ts')], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: ctx.config.DATABASE_URL, LOG_LEVEL: 'info', ROCKERBOOK_EXIT_WITH_PARENT: '1' },
    stdio: ['ignore', 'pipe', 'inherit'],
  })
  const lines: string[] = []
  let buffer = ''
  const ready = new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error('worker did not start')), timeoutMs)
    child.stdout!.on('data', (chunk: Buffer) => {
      buffer += chunk.toString()
      const parts = buffer.split('\n')
      buffer = parts.pop() ?? ''
      lines.push(...parts)
      if (parts.some((l) => l.includes('worker ready'))) {
        clearTimeout(timer)
        resolve()
      }
    })
    child.once('exit', (code) => reject(new Error(`worker exited with ${code} before it was ready`)))
  })
  await ready
  return {
    child,
    lines,
    async stop(signal = 'SIGTERM') {
      if (child.exitCode !== null || child.signalCode !== null) return
      const exited = once(child, 'exit')
      child.kill(signal)
      await exited
    },
  }
}

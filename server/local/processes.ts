import { spawn, type ChildProcess } from 'node:child_process'
import { once } from 'node:events'
import { join } from 'node:path'
import { projectRoot } from './profiles'

/** Starts a TypeScript entry point (server or worker) as a child process with the given environment. */
export function startNodeProcess(entry: string, env: Record<string, string>, label: string, quiet = false): ChildProcess {
  const child = spawn(process.execPath, ['--import', 'tsx', join(projectRoot, entry)], {
    cwd: projectRoot,
    env: { ...process.env, ...env },
    stdio: quiet ? ['ignore', 'ignore', 'inherit'] : ['ignore', 'inherit', 'inherit'],
  })
  child.on('exit', (code, signal) => {
    if (code !== 0 && signal === null && !stopping) console.error(`✖ ${label} exited with code ${code}`)
  })
  return child
}

let stopping = false

/** Sends SIGTERM, and SIGKILL after a grace period, so Ctrl-C never leaves a process behind. */
export async function stopProcess(child: ChildProcess, graceMs = 8_000): Promise<void> {
  stopping = true
  if (child.exitCode !== null || child.signalCode !== null) return
  const exited = once(child, 'exit')
  child.kill('SIGTERM')
  const timer = setTimeout(() => child.kill('SIGKILL'), graceMs)
  await exited
  clearTimeout(timer)
}

/** Polls `url` until it answers 200, or fails with the last reason after `timeoutMs`. */
export async function waitForHttp(url: string, timeoutMs = 60_000): Promise<void> {
  const deadline = Date.now() + timeoutMs
  let reason = 'no answer'
  while (Date.now() < deadline) {
    try {
      const res = await fetch(url)
      if (res.ok) return
      reason = `HTTP ${res.status}: ${await res.text()}`
    } catch (error) {
      reason = (error as Error).message
    }
    await new Promise((r) => setTimeout(r, 300))
  }
  throw new Error(`${url} did not become ready: ${reason}`)
}

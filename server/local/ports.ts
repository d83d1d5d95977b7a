import { createServer } from 'node:net'

function isFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const probe = createServer()
    probe.once('error', () => resolve(false))
    probe.listen(port, '127.0.0.1', () => probe.close(() => resolve(true)))
  })
}

/** Fails early, naming the port, when another run (or another program) already holds one of ours. */
export async function assertPortsFree(ports: Record<string, number>): Promise<void> {
  const busy: string[] = []
  for (const [name, port] of Object.entries(ports)) if (!(await isFree(port))) busy.push(`${name} (${port})`)
  if (busy.length) {
    throw new Error(
      `Port(s) already in use on 127.0.0.1: ${busy.join(', ')}. Is another \`npm start\` or \`npm test\` running? ` +
        'Stop it (Ctrl-C) or, for tests, give this run its own ports with TEST_SLOT=1.',
    )
  }
}

import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import S3rver from 's3rver'
import { step } from './say'

/** Runs the S3-compatible fake on loopback with its objects in the profile's data folder. */
export async function startS3Fake(dataDir: string, port: number): Promise<() => Promise<void>> {
  const directory = join(dataDir, 's3')
  mkdirSync(directory, { recursive: true })
  step(`Starting the local S3 fake on 127.0.0.1:${port}`)
  const server = new S3rver({ address: '127.0.0.1', port, silent: true, directory })
  await server.run()
  return () => server.close()
}

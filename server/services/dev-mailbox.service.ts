import { readdir, readFile } from 'node:fs/promises'
import { join } from 'node:path'
import { devMailSchema, type DevMail } from '../../shared/schemas/dev-mail'

/**
 * Reads the messages the local SMTP fake captured (one JSON file each). Only configured while the app runs on its
 * embedded services; with a real relay there is no mailbox to read.
 */
export async function listCapturedMail(dir: string, limit = 200): Promise<DevMail[]> {
  let names: string[]
  try {
    names = await readdir(dir)
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return []
    throw error
  }
  const newestFirst = names.filter((n) => n.endsWith('.json')).sort().reverse().slice(0, limit)
  const messages = await Promise.all(newestFirst.map(async (name) => JSON.parse(await readFile(join(dir, name), 'utf8'))))
  return messages.map((m) => devMailSchema.parse(m))
}

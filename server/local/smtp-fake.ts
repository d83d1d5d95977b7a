import { randomUUID } from 'node:crypto'
import { mkdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { simpleParser, type AddressObject } from 'mailparser'
import { SMTPServer } from 'smtp-server'
import type { DevMail } from '../../shared/schemas/dev-mail'
import { step } from './say'

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(field) ? field : field ? [field] : []
  return list.flatMap((a) => a.value.map((v) => v.address ?? '')).filter(Boolean)
}

/** Every http(s) link in the plain text, trailing punctuation trimmed, in order of appearance. */
export function linksIn(text: string): string[] {
  return [...text.matchAll(/https?:\/\/[^\s<>"')]+/g)].map((m) => m[0].replace(/[.,;:!?]+$/, ''))
}

/**
 * A local SMTP server that accepts every message and keeps it as JSON in `<dataDir>/mail`, where the app's
 * development mailbox reads it. It never relays anything anywhere.
 */
export async function startSmtpFake(dataDir: string, port: number): Promise<() => Promise<void>> {
  const dir = join(dataDir, 'mail')
  mkdirSync(dir, { recursive: true })
  step(`Starting the local SMTP fake on 127.0.0.1:${port}`)
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const receivedAt = new Date()
          const text = parsed.text ?? ''
          const mail: DevMail = {
            id: randomUUID(),
            to: addresses(parsed.to),
            subject: parsed.subject ?? '',
            text,
            links: linksIn(text),
            receivedAt: receivedAt.toISOString(),
          }
          // The file name sorts by arrival, so the mailbox lists newest first without opening every file.
          writeFileSync(join(dir, `${receivedAt.getTime()}-${process.hrtime.bigint()}-${mail.id}.json`), JSON.stringify(mail))
          callback()
        })
        .catch((error: Error) => callback(error))
    },
  })
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject)
    server.listen(port, '127.0.0.1', () => resolve())
  })
  return () => new Promise<void>((resolve) => server.close(() => resolve()))
}

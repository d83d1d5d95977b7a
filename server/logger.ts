import { pino, type Logger } from 'pino'

/** JSON logs on stderr-friendly stdout; one logger per process, children per request and per job. */
export function createLogger(level: string, name: string): Logger {
  return pino({ name, level, base: { pid: process.pid }, timestamp: pino.stdTimeFunctions.isoTime })
}

import type { DevMail } from '../../shared/schemas/dev-mail'
import { request } from './client'

/** Mail captured by the local SMTP fake, newest first (development only). */
export function listCapturedMail(): Promise<DevMail[]> {
  return request<DevMail[]>('/dev/mail')
}

/** Whether this server has a development mailbox (only while it runs on its local SMTP fake). */
export async function hasDevMailbox(): Promise<boolean> {
  try {
    return (await fetch('/api/dev/mail', { method: 'HEAD', credentials: 'same-origin' })).ok
  } catch {
    return false
  }
}

import type { DevMail } from '../../shared/schemas/dev-mail'
import { request } from './client'

/** Mail captured by the local SMTP fake, newest first (development only). */
export function listCapturedMail(): Promise<DevMail[]> {
  return request<DevMail[]>('/dev/mail')
}

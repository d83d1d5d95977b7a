import type { Health } from '../../shared/schemas/health'
import { request } from './client'

/** The service status; a 503 still carries the report, so it is read rather than thrown. */
export function getHealth(): Promise<Health> {
  return request<Health>('/health', { acceptStatus: [503] })
}

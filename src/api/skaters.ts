import type { SkaterSummary } from '../../shared/schemas/sharing'
import { request } from './client'

/** Every skater the signed-in person may see, with how they see each. */
export function listSkaters(): Promise<SkaterSummary[]> {
  return request<SkaterSummary[]>('/skaters')
}

export function createSkater(name: string): Promise<{ id: string }> {
  return request<{ id: string }>('/skaters', { method: 'POST', body: { name } })
}

export function getSkater(id: string): Promise<SkaterSummary> {
  return request<SkaterSummary>(`/skaters/${encodeURIComponent(id)}`)
}

/** A coach's skaters. */
export function listRoster(): Promise<SkaterSummary[]> {
  return request<SkaterSummary[]>('/roster')
}

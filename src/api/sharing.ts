import type { Share } from '../../shared/schemas/sharing'
import { request } from './client'

/** Open shares the signed-in person is a party to (as owner, coach or shop member). */
export function listShares(): Promise<Share[]> {
  return request<Share[]>('/shares')
}

export function inviteCoach(skaterId: string, email: string): Promise<Share> {
  return request<Share>(`/skaters/${encodeURIComponent(skaterId)}/shares/coach`, { method: 'POST', body: { email } })
}

export function shareWithShop(skaterId: string, shopId: string): Promise<Share> {
  return request<Share>(`/skaters/${encodeURIComponent(skaterId)}/shares/shop`, { method: 'POST', body: { shopId } })
}

export function acceptShare(id: string): Promise<Share> {
  return request<Share>(`/shares/${encodeURIComponent(id)}/accept`, { method: 'POST' })
}

/** Ends a share or declines an invitation. */
export function endShare(id: string): Promise<void> {
  return request<void>(`/shares/${encodeURIComponent(id)}`, { method: 'DELETE' })
}

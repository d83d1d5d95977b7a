import type { ShopInfo, ShopInvitationInfo, ShopMemberInfo, SkaterSummary } from '../../shared/schemas/sharing'
import { request } from './client'

const shopPath = (id: string) => `/shops/${encodeURIComponent(id)}`

export function listShops(): Promise<ShopInfo[]> {
  return request<ShopInfo[]>('/shops')
}

export function createShop(name: string): Promise<ShopInfo> {
  return request<ShopInfo>('/shops', { method: 'POST', body: { name } })
}

export function listShopMembers(shopId: string): Promise<ShopMemberInfo[]> {
  return request<ShopMemberInfo[]>(`${shopPath(shopId)}/members`)
}

export function removeShopMember(shopId: string, accountId: string): Promise<void> {
  return request<void>(`${shopPath(shopId)}/members/${encodeURIComponent(accountId)}`, { method: 'DELETE' })
}

export function listShopInvitations(shopId: string): Promise<ShopInvitationInfo[]> {
  return request<ShopInvitationInfo[]>(`${shopPath(shopId)}/invitations`)
}

export function inviteTechnician(shopId: string, email: string): Promise<ShopInvitationInfo> {
  return request<ShopInvitationInfo>(`${shopPath(shopId)}/invitations`, { method: 'POST', body: { email } })
}

export function listShopSkaters(shopId: string): Promise<SkaterSummary[]> {
  return request<SkaterSummary[]>(`${shopPath(shopId)}/skaters`)
}

/** Technician invitations addressed to the signed-in person. */
export function listMyShopInvitations(): Promise<ShopInvitationInfo[]> {
  return request<ShopInvitationInfo[]>('/shop-invitations')
}

export function acceptShopInvitation(id: string): Promise<ShopInfo> {
  return request<ShopInfo>(`/shop-invitations/${encodeURIComponent(id)}/accept`, { method: 'POST' })
}

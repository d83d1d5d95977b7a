import type { AdminUser } from '../../shared/schemas/admin'
import type { Role } from '../../shared/schemas/auth'
import { request } from './client'

export function searchUsers(q: string): Promise<AdminUser[]> {
  return request<AdminUser[]>(`/admin/users${q ? `?q=${encodeURIComponent(q)}` : ''}`)
}

export function updateUser(id: string, change: { roles?: Role[]; disabled?: boolean }): Promise<AdminUser> {
  return request<AdminUser>(`/admin/users/${encodeURIComponent(id)}`, { method: 'PATCH', body: change })
}

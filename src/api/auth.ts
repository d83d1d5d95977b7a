import type { Me, SessionInfo, SignInBody, SignUpBody } from '../../shared/schemas/auth'
import { ApiError, request } from './client'

/** The signed-in person, or null when there is no valid session. */
export async function getMe(): Promise<Me | null> {
  try {
    return await request<Me>('/auth/me')
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null
    throw error
  }
}

export function signIn(body: SignInBody): Promise<Me> {
  return request<Me>('/auth/sign-in', { method: 'POST', body })
}

export function signUp(body: SignUpBody): Promise<Me> {
  return request<Me>('/auth/sign-up', { method: 'POST', body })
}

export function signOut(): Promise<void> {
  return request<void>('/auth/sign-out', { method: 'POST' })
}

export function verifyEmail(token: string): Promise<void> {
  return request<void>('/auth/verify', { method: 'POST', body: { token } })
}

export function resendVerification(): Promise<{ sent: boolean }> {
  return request('/auth/verify/resend', { method: 'POST' })
}

export function requestPasswordReset(email: string): Promise<{ sent: boolean }> {
  return request('/auth/reset-request', { method: 'POST', body: { email } })
}

export function resetPassword(token: string, password: string): Promise<void> {
  return request<void>('/auth/reset', { method: 'POST', body: { token, password } })
}

export function changePassword(currentPassword: string, newPassword: string): Promise<void> {
  return request<void>('/auth/password', { method: 'POST', body: { currentPassword, newPassword } })
}

export function listSessions(): Promise<SessionInfo[]> {
  return request<SessionInfo[]>('/auth/sessions')
}

export function revokeSession(id: string): Promise<void> {
  return request<void>(`/auth/sessions/${encodeURIComponent(id)}`, { method: 'DELETE' })
}

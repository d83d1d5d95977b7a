import type { Role } from '../../shared/schemas/auth'
import type { SkaterVia } from '../../shared/schemas/sharing'

/**
 * The one statement of who may do what with a skater's data. Routes declare coarse roles (`requireRole`); the
 * services ask `assertSkaterAccess`, which applies this table to the caller's relation to the skater.
 *
 * - read:     see the skater, their blades, analyses and history
 * - write:    add measurements (photos, analyses) and record sharpenings
 * - annotate: annotate analyses and set preferred targets
 * - manage:   rename the skater, share and end shares (the owner alone)
 */
export type SkaterAccessMode = 'read' | 'write' | 'annotate' | 'manage'

export const skaterAccessByRelation: Record<SkaterVia, readonly SkaterAccessMode[]> = {
  owner: ['read', 'write', 'annotate', 'manage'],
  coach: ['read', 'annotate'],
  shop: ['read', 'write'],
}

/** A coach share counts only while the account still holds the coach role (checked in `access.service.ts`). */
export const COACH_SHARE_ROLE: Role = 'coach'

export function relationAllows(via: readonly SkaterVia[], mode: SkaterAccessMode): boolean {
  return via.some((v) => skaterAccessByRelation[v].includes(mode))
}

/** Roles that come with doing something rather than being handed out by an admin. */
export const earnedRoles = {
  signUpSkates: 'skater',
  signUpCoaches: 'coach',
  createShop: 'shop_admin',
  acceptShopInvitation: 'technician',
} as const satisfies Record<string, Role>

/** Who may create skater profiles, be invited as coach, and manage a shop. */
export const routeRoles = {
  createSkater: ['skater'],
  coachRoster: ['coach'],
  acceptCoachInvitation: ['coach'],
  admin: ['admin'],
} as const satisfies Record<string, readonly Role[]>

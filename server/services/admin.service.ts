import type { Role } from '../../shared/schemas/auth'
import type { AdminUser } from '../../shared/schemas/admin'
import type { AppContext } from '../context'
import { Account } from '../entities/account.entity'
import { InvalidError, NotFoundError } from '../errors'
import type { AuthUser } from '../middleware/require-auth'
import { endAllSessions } from './session.service'

type Ctx = Pick<AppContext, 'db' | 'config'>

function toAdminUser(a: Account): AdminUser {
  return {
    id: a.id,
    email: a.email,
    name: a.name,
    roles: a.roles,
    emailVerified: a.emailVerifiedAt !== null,
    disabled: a.disabledAt !== null,
    createdAt: a.createdAt.toISOString(),
  }
}

/** Accounts matching `q` in name or e-mail (all when empty), newest first, at most 200. */
export async function searchUsers(ctx: Ctx, q: string | undefined): Promise<AdminUser[]> {
  const query = ctx.db.getRepository(Account).createQueryBuilder('a').orderBy('a.created_at', 'DESC').limit(200)
  if (q) {
    const pattern = `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`
    query.where('(a.email ILIKE :pattern OR a.name ILIKE :pattern)', { pattern })
  }
  return (await query.getMany()).map(toAdminUser)
}

/**
 * Sets roles and/or disables an account. Disabling ends its sessions at once. An admin cannot disable themselves
 * or drop their own admin role, so the platform is never left without one by accident.
 */
export async function updateUser(ctx: Ctx, admin: AuthUser, id: string, change: { roles?: Role[]; disabled?: boolean }): Promise<AdminUser> {
  const repo = ctx.db.getRepository(Account)
  const account = await repo.findOneBy({ id })
  if (!account) throw new NotFoundError('That account')
  if (id === admin.id && (change.disabled || (change.roles && !change.roles.includes('admin')))) {
    throw new InvalidError('You cannot disable your own account or remove your own admin role.', undefined, 'SELF_LOCKOUT')
  }
  if (change.roles) account.roles = [...new Set(change.roles)]
  if (change.disabled !== undefined) account.disabledAt = change.disabled ? (account.disabledAt ?? new Date()) : null
  await repo.save(account)
  if (change.disabled) await endAllSessions(ctx, id)
  return toAdminUser(account)
}

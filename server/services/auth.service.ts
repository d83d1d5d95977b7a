import type { Me, Role } from '../../shared/schemas/auth'
import type { AppContext } from '../context'
import { Account } from '../entities/account.entity'
import { AppError, ConflictError, ForbiddenError, InvalidError } from '../errors'
import { resetMail, verificationMail } from './auth-mail'
import { consumeToken, issueToken, retireTokens } from './email-token.service'
import type { OutgoingMail } from './mail.service'
import { hashPassword, verifyDecoy, verifyPassword } from './password.service'
import { authFor, endAllSessions } from './session.service'

type Ctx = Pick<AppContext, 'db' | 'config' | 'mail' | 'logger'>

export function toMe(account: Account): Me {
  return {
    id: account.id,
    email: account.email,
    name: account.name,
    roles: account.roles,
    emailVerified: account.emailVerifiedAt !== null,
  }
}

export function findAccountByEmail(ctx: Pick<AppContext, 'db'>, email: string): Promise<Account | null> {
  return ctx.db.getRepository(Account).createQueryBuilder('a').where('lower(a.email) = lower(:email)', { email }).getOne()
}

export interface NewAccount {
  email: string
  password: string
  name: string
  roles: Role[]
  verified?: boolean
}

/** Creates an account; the seed and tests use it directly, sign-up through `signUp`. */
export async function createAccount(ctx: Pick<AppContext, 'db'>, input: NewAccount): Promise<Account> {
  if (await findAccountByEmail(ctx, input.email)) throw new ConflictError('An account with this e-mail address exists. Sign in, or reset its password.', 'EMAIL_TAKEN')
  const repo = ctx.db.getRepository(Account)
  return repo.save(
    repo.create({
      email: input.email.toLowerCase(),
      name: input.name,
      passwordHash: await hashPassword(input.password),
      roles: [...new Set(input.roles)],
      emailVerifiedAt: input.verified ? new Date() : null,
    }),
  )
}

/** Sends mail a person is waiting for now, without holding the request; a failure is logged, the link can be re-sent. */
function sendSoon(ctx: Ctx, mail: OutgoingMail): void {
  ctx.mail.send(mail).catch((err: unknown) => ctx.logger.error({ err, subject: mail.subject }, 'account mail failed'))
}

function appLink(ctx: Ctx, path: string, token: string): string {
  const url = new URL(path, ctx.config.PUBLIC_URL)
  url.searchParams.set('token', token)
  return url.toString()
}

export async function signUp(ctx: Ctx, body: { email: string; password: string; name: string; skates: boolean; coaches: boolean }): Promise<Account> {
  const roles: Role[] = []
  if (body.skates) roles.push('skater')
  if (body.coaches) roles.push('coach')
  if (ctx.config.FIRST_ADMIN_EMAIL?.toLowerCase() === body.email && !(await adminExists(ctx))) roles.push('admin')
  const account = await createAccount(ctx, { ...body, roles })
  await sendVerification(ctx, account)
  return account
}

async function adminExists(ctx: Pick<AppContext, 'db'>): Promise<boolean> {
  const rows = await ctx.db.query(`SELECT 1 FROM accounts WHERE 'admin' = ANY(roles) LIMIT 1`)
  return rows.length > 0
}

export async function sendVerification(ctx: Ctx, account: Account): Promise<void> {
  if (account.emailVerifiedAt) throw new ConflictError('This e-mail address is confirmed already.', 'ALREADY_VERIFIED')
  await retireTokens(ctx, account.id, 'verify')
  const token = await issueToken(ctx, account.id, 'verify')
  sendSoon(ctx, verificationMail(account.email, account.name, appLink(ctx, '/verify', token)))
}

const badCredentials = () => new AppError(401, 'INVALID_CREDENTIALS', 'That e-mail address and password do not match an account.')

/** One answer, in words and in time, for an unknown address and a wrong password. */
export async function authenticate(ctx: Pick<AppContext, 'db'>, email: string, password: string): Promise<Account> {
  const account = await findAccountByEmail(ctx, email)
  if (!account) {
    await verifyDecoy(password)
    throw badCredentials()
  }
  if (!(await verifyPassword(account.passwordHash, password))) throw badCredentials()
  if (account.disabledAt) throw new ForbiddenError('This account is disabled. Contact the people who run Rockerbook.', 'ACCOUNT_DISABLED')
  return account
}

export async function verifyEmail(ctx: Pick<AppContext, 'db'>, token: string): Promise<void> {
  const accountId = await consumeToken(ctx, token, 'verify')
  await ctx.db.getRepository(Account).update({ id: accountId }, { emailVerifiedAt: new Date() })
}

/** Always the same answer, whether or not the address has an account. */
export async function requestReset(ctx: Ctx, email: string): Promise<void> {
  const account = await findAccountByEmail(ctx, email)
  if (!account || account.disabledAt) return
  await retireTokens(ctx, account.id, 'reset')
  const token = await issueToken(ctx, account.id, 'reset')
  sendSoon(ctx, resetMail(account.email, account.name, appLink(ctx, '/reset-password', token)))
}

/** Sets the new password and ends every session: whoever knew the old one is signed out. */
export async function resetPassword(ctx: Ctx, token: string, password: string): Promise<void> {
  const accountId = await consumeToken(ctx, token, 'reset')
  await ctx.db.getRepository(Account).update({ id: accountId }, { passwordHash: await hashPassword(password) })
  // Following the mailed link proves the address as well as a verification link would.
  await ctx.db.query(`UPDATE accounts SET email_verified_at = now() WHERE id = $1 AND email_verified_at IS NULL`, [accountId])
  await endAllSessions(ctx, accountId)
}

/** Changes the password and ends the account's other sessions, keeping the one that asked. */
export async function changePassword(ctx: Ctx, accountId: string, current: string, next: string, keepSessionId: string): Promise<void> {
  const account = await ctx.db.getRepository(Account).findOneByOrFail({ id: accountId })
  if (!(await verifyPassword(account.passwordHash, current))) {
    throw new InvalidError('The current password is not right.', [{ path: 'currentPassword', message: 'The current password is not right.' }], 'WRONG_PASSWORD')
  }
  await ctx.db.getRepository(Account).update({ id: accountId }, { passwordHash: await hashPassword(next) })
  const lucia = authFor(ctx)
  for (const s of await lucia.getUserSessions(accountId)) if (s.id !== keepSessionId) await lucia.invalidateSession(s.id)
}

import { createHash, randomBytes } from 'node:crypto'
import { IsNull, MoreThan } from 'typeorm'
import type { AppContext } from '../context'
import { EmailToken } from '../entities/email-token.entity'
import { InvalidError } from '../errors'

/** How long each kind of link stays usable. */
export const TOKEN_LIFETIME_MS = { verify: 48 * 3600_000, reset: 3600_000 } as const

function digest(token: string): string {
  return createHash('sha256').update(token).digest('hex')
}

/** Issues a fresh single-use token; only its digest is stored, so a database read cannot replay a link. */
export async function issueToken(ctx: Pick<AppContext, 'db'>, accountId: string, purpose: EmailToken['purpose']): Promise<string> {
  const token = randomBytes(32).toString('base64url')
  await ctx.db.getRepository(EmailToken).insert({
    accountId,
    purpose,
    tokenHash: digest(token),
    expiresAt: new Date(Date.now() + TOKEN_LIFETIME_MS[purpose]),
  })
  return token
}

/**
 * Marks a token used and returns its account, atomically, so two clicks of one link cannot both succeed. Unknown,
 * used and expired tokens answer alike.
 */
export async function consumeToken(ctx: Pick<AppContext, 'db'>, token: string, purpose: EmailToken['purpose']): Promise<string> {
  const result = await ctx.db
    .getRepository(EmailToken)
    .createQueryBuilder()
    .update()
    .set({ usedAt: () => 'now()' })
    .where({ tokenHash: digest(token), purpose, usedAt: IsNull(), expiresAt: MoreThan(new Date()) })
    .returning(['accountId'])
    .execute()
  const row = (result.raw as { account_id: string }[])[0]
  if (!row) throw new InvalidError('This link is not valid any more: it was used already or it expired. Ask for a new one.', undefined, 'TOKEN_INVALID')
  return row.account_id
}

/** Retires the account's other open tokens of this purpose, so only the newest link works. */
export async function retireTokens(ctx: Pick<AppContext, 'db'>, accountId: string, purpose: EmailToken['purpose']): Promise<void> {
  await ctx.db.getRepository(EmailToken).update({ accountId, purpose, usedAt: IsNull() }, { usedAt: new Date() })
}

import type { Request, RequestHandler } from 'express'
import { rateLimit } from 'express-rate-limit'

interface Limit {
  windowMs: number
  limit: number
  /** Count only failed attempts (sign-in): a person who gets in is not slowed down. */
  failuresOnly?: boolean
}

const MINUTE = 60_000

/**
 * Abuse limits on the account endpoints, per client address and per account (the e-mail the request names).
 * The numbers are our own choice; tests read them from here rather than repeating them.
 */
export const authRateLimits = {
  signInPerAddress: { windowMs: 15 * MINUTE, limit: 50, failuresOnly: true },
  signInPerAccount: { windowMs: 15 * MINUTE, limit: 10, failuresOnly: true },
  signUpPerAddress: { windowMs: 60 * MINUTE, limit: 30 },
  signUpPerAccount: { windowMs: 60 * MINUTE, limit: 5 },
  resetPerAddress: { windowMs: 60 * MINUTE, limit: 30 },
  resetPerAccount: { windowMs: 60 * MINUTE, limit: 3 },
} satisfies Record<string, Limit>

function emailKey(req: Request): string {
  const email = (req.body as { email?: unknown } | undefined)?.email
  return `account:${typeof email === 'string' ? email.trim().toLowerCase() : ''}`
}

function limiter(limit: Limit, byAccount: boolean): RequestHandler {
  return rateLimit({
    windowMs: limit.windowMs,
    limit: limit.limit,
    skipSuccessfulRequests: limit.failuresOnly ?? false,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    ...(byAccount ? { keyGenerator: emailKey } : {}),
    handler: (_req, res, _next, options) => {
      const minutes = Math.ceil(options.windowMs / MINUTE)
      res.status(429).json({ error: { code: 'RATE_LIMITED', message: `Too many attempts. Wait up to ${minutes} minutes and try again.` } })
    },
  })
}

/** Fresh limiters (and counters) for one app instance, so each test's app starts from zero. */
export function createAuthLimiters() {
  return {
    signIn: [limiter(authRateLimits.signInPerAddress, false), limiter(authRateLimits.signInPerAccount, true)],
    signUp: [limiter(authRateLimits.signUpPerAddress, false), limiter(authRateLimits.signUpPerAccount, true)],
    reset: [limiter(authRateLimits.resetPerAddress, false), limiter(authRateLimits.resetPerAccount, true)],
  }
}

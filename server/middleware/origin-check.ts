import type { RequestHandler } from 'express'
import { ForbiddenError } from '../errors'

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS'])

/**
 * Refuses a state-changing request unless its `Origin` header is the app's own public origin: together with the
 * SameSite=Lax cookie this stops another site from acting with a signed-in person's session. Browsers send Origin
 * on every POST/PUT/PATCH/DELETE; API clients and tests must send it too.
 */
export function originCheck(publicUrl: string): RequestHandler {
  const expected = new URL(publicUrl).origin
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) return next()
    if (req.headers.origin !== expected) {
      throw new ForbiddenError('This request did not come from the Rockerbook app.', 'ORIGIN_MISMATCH')
    }
    next()
  }
}

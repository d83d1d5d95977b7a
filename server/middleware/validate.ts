import type { RequestHandler } from 'express'
import type { ZodType } from 'zod'

interface Schemas {
  params?: ZodType
  query?: ZodType
  body?: ZodType
}

/**
 * Parses the named parts of the request and replaces them with the parsed output, so handlers see typed, coerced
 * values. A failure throws the ZodError, which the error handler turns into a 400 listing the failing paths.
 */
export function validate(schemas: Schemas): RequestHandler {
  return (req, _res, next) => {
    if (schemas.params) req.params = schemas.params.parse(req.params) as typeof req.params
    // Express 5 exposes `req.query` through a getter; redefine it to hold the parsed value.
    if (schemas.query) {
      const query = schemas.query.parse(req.query)
      Object.defineProperty(req, 'query', { value: query, writable: true, configurable: true })
    }
    if (schemas.body) req.body = schemas.body.parse(req.body ?? {})
    next()
  }
}

import type { ErrorRequestHandler, RequestHandler } from 'express'
import { ZodError } from 'zod'
import { AppError } from '../errors'

interface ErrorBody {
  error: { code: string; message: string; details?: unknown }
}

function fromZod(error: ZodError): ErrorBody {
  const details = error.issues.map((issue) => ({ path: issue.path.join('.'), message: issue.message }))
  const first = details[0]
  const message = first ? `${first.path || 'request'}: ${first.message}` : 'The request is not valid.'
  return { error: { code: 'VALIDATION', message, details } }
}

/** Body-parser and multer errors carry a status and a type/code of their own; keep their 4xx meaning. */
function fromHttpLike(error: { status?: number; statusCode?: number; type?: string; code?: string; message?: string }) {
  const status = error.status ?? error.statusCode
  if (!status || status < 400 || status >= 500) return null
  const messages: Record<string, string> = {
    'entity.parse.failed': 'The request body is not valid JSON.',
    'entity.too.large': 'The request body is too large.',
  }
  const message = (error.type && messages[error.type]) ?? 'The request could not be read.'
  return { status, body: { error: { code: error.code ?? 'BAD_REQUEST', message } } }
}

/**
 * The one place errors become HTTP answers: typed errors keep their status and message, zod errors become 400 with
 * the failing paths, anything else is logged with the request id and answered with a generic 500.
 */
export const errorHandler: ErrorRequestHandler = (error, req, res, _next) => {
  if (error instanceof AppError) {
    const body: ErrorBody = { error: { code: error.code, message: error.message } }
    if (error.details !== undefined) body.error.details = error.details
    res.status(error.status).json(body)
    return
  }
  if (error instanceof ZodError) {
    res.status(400).json(fromZod(error))
    return
  }
  const httpLike = fromHttpLike(error ?? {})
  if (httpLike) {
    res.status(httpLike.status).json(httpLike.body)
    return
  }
  req.log.error({ err: error }, 'unhandled error')
  res.status(500).json({
    error: { code: 'INTERNAL', message: `Something went wrong on our side. Try again; if it persists, quote request ${req.id}.` },
  })
}

/** Unknown `/api` paths answer JSON 404 instead of falling through to the client app. */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({ error: { code: 'NOT_FOUND', message: `No API route ${req.method} ${req.path}.` } })
}

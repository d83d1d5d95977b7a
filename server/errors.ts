/** Typed failures the services throw; `middleware/error-handler.ts` is the one place that maps them to HTTP. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message)
    this.name = new.target.name
  }
}

export class InvalidError extends AppError {
  constructor(message: string, details?: unknown, code = 'INVALID') {
    super(400, code, message, details)
  }
}

export class UnauthorizedError extends AppError {
  constructor(message = 'Sign in to continue.') {
    super(401, 'UNAUTHORIZED', message)
  }
}

export class ForbiddenError extends AppError {
  constructor(message = 'You do not have permission to do that.', code = 'FORBIDDEN') {
    super(403, code, message)
  }
}

/** Answers alike for a row that does not exist and one the caller may not see, so ids cannot be probed. */
export class NotFoundError extends AppError {
  constructor(what = 'That item') {
    super(404, 'NOT_FOUND', `${what} was not found.`)
  }
}

export class ConflictError extends AppError {
  constructor(message: string, code = 'CONFLICT') {
    super(409, code, message)
  }
}

export class PayloadTooLargeError extends AppError {
  constructor(message: string) {
    super(413, 'TOO_LARGE', message)
  }
}

export class UnsupportedMediaError extends AppError {
  constructor(message: string) {
    super(415, 'UNSUPPORTED_MEDIA', message)
  }
}

export class ServiceUnavailableError extends AppError {
  constructor(message: string) {
    super(503, 'UNAVAILABLE', message)
  }
}

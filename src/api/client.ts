/** A failed API call, carrying the server's error code and a message fit to show a person. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message)
    this.name = 'ApiError'
  }
}

const offlineMessage = 'Rockerbook could not reach its server. Check your connection and try again.'

interface RequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE'
  body?: unknown
  /** Accept a non-2xx answer whose body is still the expected shape (the health check's 503). */
  acceptStatus?: number[]
}

/** The one wrapper around fetch: same-origin cookies, JSON in and out, every failure as an ApiError. */
export async function request<T>(path: string, options: RequestOptions = {}): Promise<T> {
  const isForm = options.body instanceof FormData
  let response: Response
  try {
    response = await fetch(`/api${path}`, {
      method: options.method ?? 'GET',
      credentials: 'same-origin',
      headers: options.body === undefined || isForm ? {} : { 'Content-Type': 'application/json' },
      body: options.body === undefined ? undefined : isForm ? (options.body as FormData) : JSON.stringify(options.body),
    })
  } catch {
    throw new ApiError(0, 'OFFLINE', offlineMessage)
  }
  const payload = response.status === 204 ? undefined : await response.json().catch(() => undefined)
  if (response.ok || options.acceptStatus?.includes(response.status)) return payload as T
  const error = (payload as { error?: { code?: string; message?: string; details?: unknown } } | undefined)?.error
  throw new ApiError(
    response.status,
    error?.code ?? 'HTTP_' + response.status,
    error?.message ?? `The server answered ${response.status}. Try again in a moment.`,
    error?.details,
  )
}

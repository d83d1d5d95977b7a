import { randomUUID } from 'node:crypto'
import { existsSync } from 'node:fs'
import { resolve } from 'node:path'
import express, { type Express } from 'express'
import helmet from 'helmet'
import { pinoHttp } from 'pino-http'
import type { AppContext } from './context'
import { apiNotFound, errorHandler } from './middleware/error-handler'
import { apiRoutes } from './routes'

/** Builds the Express app without listening, so tests drive it with supertest and `main.ts` serves it. */
export function createApp(ctx: AppContext): Express {
  const app = express()
  app.disable('x-powered-by')
  app.set('trust proxy', 'loopback')
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // Naive UI injects its component styles at run time; scripts stay same-origin only.
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:', new URL(ctx.config.S3_ENDPOINT).origin],
          'upgrade-insecure-requests': null,
        },
      },
    }),
  )
  app.use(
    pinoHttp({
      logger: ctx.logger,
      genReqId: (req, res) => {
        const id = (req.headers['x-request-id'] as string | undefined) ?? randomUUID()
        res.setHeader('x-request-id', id)
        return id
      },
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      // Headers carry session cookies: log what identifies the request, not everything it carried.
      serializers: {
        req: (req: { id: string; method: string; url: string }) => ({ id: req.id, method: req.method, url: req.url }),
        res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      },
    }),
  )
  app.use(express.json({ limit: '1mb' }))
  app.use('/api', apiRoutes(ctx), apiNotFound)
  serveClient(app, ctx.config.CLIENT_DIST)
  app.use(errorHandler)
  return app
}

/** Serves the built client and answers unknown paths with its index.html so client-side routes survive a reload. */
function serveClient(app: Express, distDir: string): void {
  const dir = resolve(distDir)
  if (!existsSync(resolve(dir, 'index.html'))) return
  app.use(express.static(dir, { index: false, maxAge: '1h' }))
  app.get('/{*path}', (_req, res) => res.sendFile(resolve(dir, 'index.html')))
}

import { z } from 'zod'

/**
 * Everything the server and workers need from their environment. Defaults point at the local services that
 * `npm start` runs on loopback; production sets every value explicitly (see README, "Configuration").
 */
const configSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  PORT: z.coerce.number().int().min(1).max(65535).default(5180),
  HOST: z.string().default('127.0.0.1'),
  PUBLIC_URL: z.url().default('http://127.0.0.1:5180'),
  DATABASE_URL: z.url().default('postgres://postgres@127.0.0.1:55432/rockerbook'),
  S3_ENDPOINT: z.url().default('http://127.0.0.1:9410'),
  S3_BUCKET: z.string().min(3).default('rockerbook'),
  S3_ACCESS_KEY: z.string().min(1).default('S3RVER'),
  S3_SECRET_KEY: z.string().min(1).default('S3RVER'),
  S3_REGION: z.string().default('us-east-1'),
  SMTP_URL: z.url().default('smtp://127.0.0.1:2587'),
  MAIL_FROM: z.string().default('Rockerbook <no-reply@rockerbook.local>'),
  /** Folder where the local SMTP fake keeps captured messages; set only while running on the embedded services. */
  DEV_MAILBOX_DIR: z.string().optional(),
  /** Where the built client lives; the server serves it when present. */
  CLIENT_DIST: z.string().default('dist/client'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  FIRST_ADMIN_EMAIL: z.email().optional(),
})

export type AppConfig = z.infer<typeof configSchema>

/** Parses the environment, failing start-up with every bad variable named rather than at first use. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const parsed = configSchema.safeParse(env)
  if (!parsed.success) {
    const lines = parsed.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`)
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`)
  }
  return parsed.data
}

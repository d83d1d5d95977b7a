import type { ZodType } from 'zod'
import type { AppContext } from '../server/context'
import type { JobName } from '../shared/schemas/jobs'

export type JobOutcome = 'done' | 'skipped' | 'failed'

/** One job per file: its name, its payload schema (ids only) and a handler that reloads what it needs. */
export interface JobDefinition<P = unknown> {
  name: JobName
  payload: ZodType<P>
  /** Up to this many jobs of this kind run at once in one worker process. */
  concurrency?: number
  handle(ctx: AppContext, payload: P): Promise<JobOutcome>
}

export function defineJob<P>(definition: JobDefinition<P>): JobDefinition<P> {
  return definition
}

import { jobNames } from '../shared/schemas/jobs'
import type { JobDefinition } from './job'
import { analyzePhotoJob } from './analyze-photo'
import { sendMailJob } from './send-mail'

/** Every job this worker handles. A new job file is added here and its payload in shared/schemas/jobs.ts. */
export const jobs: JobDefinition<any>[] = [sendMailJob, analyzePhotoJob]

/** Refuses to start with a job name that has no handler, or two handlers for one name. */
export function checkRegistry(definitions: JobDefinition<any>[] = jobs): void {
  const seen = new Set<string>()
  for (const job of definitions) {
    if (seen.has(job.name)) throw new Error(`Two handlers for job ${job.name}`)
    seen.add(job.name)
  }
  const missing = jobNames.filter((name) => !seen.has(name))
  if (missing.length) throw new Error(`No handler for job(s): ${missing.join(', ')}`)
}

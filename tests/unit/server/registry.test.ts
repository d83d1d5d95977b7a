import { describe, expect, it } from 'vitest'
import { z } from 'zod'
import { checkRegistry, jobs } from '../../../workers/registry'
import { defineJob } from '../../../workers/job'

describe('job registry', () => {
  it('accepts the registered jobs', () => {
    expect(() => checkRegistry()).not.toThrow()
  })

  it('refuses two handlers for one job and a job with none', () => {
    const extra = defineJob({ name: 'mail.send', payload: z.object({}), handle: async () => 'done' })
    expect(() => checkRegistry([...jobs, extra])).toThrow(/Two handlers for job mail.send/)
    expect(() => checkRegistry([])).toThrow(/No handler for job/)
  })
})

import type { Express } from 'express'
import { afterAll, beforeAll } from 'vitest'
import { createApp } from '../../server/app'
import { createTestContext } from './test-context'

export type TestContext = Awaited<ReturnType<typeof createTestContext>>

/**
 * For one describe block: a private test context and the app on it, created before its tests and disposed after.
 * `receive` hands them to the block's own variables once they exist.
 */
export function withTestApp(receive: (ctx: TestContext, app: Express) => void): void {
  let ctx: TestContext | undefined
  beforeAll(async () => {
    ctx = await createTestContext()
    receive(ctx, createApp(ctx))
  })
  afterAll(() => ctx?.dispose())
}

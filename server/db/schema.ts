import { OutboundMail } from '../entities/outbound-mail.entity'
import { CreateSeedRuns1764640000000 } from '../migrations/1764640000000-CreateSeedRuns'
import { CreateOutboundMails1764640100000 } from '../migrations/1764640100000-CreateOutboundMails'

/**
 * Every entity and migration, imported explicitly: loading them by file glob bypasses the test runner's
 * TypeScript transform, and an explicit list shows in review what a change adds. Keep migrations in time order.
 */
export const entities = [OutboundMail]

export const migrations = [CreateSeedRuns1764640000000, CreateOutboundMails1764640100000]

import { deliverQueuedMail } from '../server/services/outbox.service'
import { jobPayloads } from '../shared/schemas/jobs'
import { defineJob } from './job'

/** `mail.send`: delivers one message from the outbox; SMTP failures throw so the queue retries with backoff. */
export const sendMailJob = defineJob({
  name: 'mail.send',
  payload: jobPayloads['mail.send'],
  concurrency: 2,
  handle: (ctx, { outboxId }) => deliverQueuedMail(ctx, outboxId),
})

import type { AppContext } from '../context'
import { OutboundMail } from '../entities/outbound-mail.entity'
import type { OutgoingMail } from './mail.service'

/**
 * Queues a notification for the worker to deliver, so a slow or failing mail relay never holds up a request.
 * Mail a person is waiting for right now (verification, password reset) is sent directly instead.
 */
export async function queueMail(ctx: Pick<AppContext, 'db' | 'queue'>, mail: OutgoingMail): Promise<string> {
  const row = await ctx.db.getRepository(OutboundMail).save({ ...mail, html: mail.html ?? null })
  await ctx.queue.send('mail.send', { outboxId: row.id }, { singletonKey: row.id })
  return row.id
}

/** Delivers one queued message; a message already sent is skipped, so a retried job never mails twice. */
export async function deliverQueuedMail(ctx: Pick<AppContext, 'db' | 'mail'>, outboxId: string): Promise<'done' | 'skipped'> {
  const repo = ctx.db.getRepository(OutboundMail)
  const row = await repo.findOneBy({ id: outboxId })
  if (!row || row.status === 'sent') return 'skipped'
  await repo.increment({ id: row.id }, 'attempts', 1)
  await ctx.mail.send({ to: row.to, subject: row.subject, text: row.text, html: row.html ?? undefined })
  await repo.update({ id: row.id }, { status: 'sent', sentAt: new Date() })
  return 'done'
}

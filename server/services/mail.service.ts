import nodemailer, { type Transporter } from 'nodemailer'
import type { AppConfig } from '../config/config'

export interface OutgoingMail {
  to: string
  subject: string
  /** Every message has a plain-text part; HTML is optional. */
  text: string
  html?: string
}

/** Sends mail through the configured SMTP server: the local fake in development, a relay in production. */
export class MailService {
  private readonly transport: Transporter
  /** Sends still on the wire, so closing waits for them instead of cutting a message off mid-conversation. */
  private readonly inFlight = new Set<Promise<unknown>>()

  constructor(private readonly config: Pick<AppConfig, 'SMTP_URL' | 'MAIL_FROM'>) {
    const url = new URL(config.SMTP_URL)
    this.transport = nodemailer.createTransport({
      host: url.hostname,
      port: Number(url.port || 25),
      secure: url.protocol === 'smtps:',
      // The local fake speaks plain SMTP on loopback; a relay URL with credentials gets TLS as negotiated.
      ignoreTLS: url.hostname === '127.0.0.1' || url.hostname === 'localhost',
      auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
      connectionTimeout: 5_000,
    })
  }

  async send(mail: OutgoingMail): Promise<void> {
    const sending = this.transport.sendMail({ from: this.config.MAIL_FROM, ...mail })
    const settled = sending.catch(() => undefined)
    this.inFlight.add(settled)
    void settled.finally(() => this.inFlight.delete(settled))
    await sending
  }

  async ping(): Promise<void> {
    await this.transport.verify()
  }

  /** Waits for messages being sent (each bounded by the transport's own timeouts), then closes the transport. */
  async close(): Promise<void> {
    await Promise.all([...this.inFlight])
    this.transport.close()
  }
}

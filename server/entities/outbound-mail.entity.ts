import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm'

/** An e-mail waiting to be delivered by the worker (`mail.send`), kept so a failed delivery can be retried. */
@Entity()
export class OutboundMail {
  @PrimaryGeneratedColumn('uuid')
  id: string

  @Column('text')
  to: string

  @Column('text')
  subject: string

  @Column('text')
  text: string

  @Column('text', { nullable: true })
  html: string | null

  @Column('text', { default: 'queued' })
  status: 'queued' | 'sent'

  @Column('int', { default: 0 })
  attempts: number

  @Column('timestamptz', { nullable: true })
  sentAt: Date | null

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date
}

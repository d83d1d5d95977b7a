import { Column, CreateDateColumn, Entity, PrimaryColumn } from 'typeorm'

/** A signed-in browser. Written and read by the lucia adapter (`services/lucia-adapter.ts`). */
@Entity()
export class AuthSession {
  @PrimaryColumn('text')
  id: string

  @Column('uuid')
  accountId: string

  @Column('timestamptz')
  expiresAt: Date

  @Column('text', { nullable: true })
  userAgent: string | null

  @Column('text', { nullable: true })
  ip: string | null

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date
}

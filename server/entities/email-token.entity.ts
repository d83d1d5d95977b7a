import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm'

/** A single-use, expiring link sent by e-mail. Only the SHA-256 of the token is kept. */
@Entity()
export class EmailToken {
  @PrimaryGeneratedColumn('uuid')
  id: string

  @Column('uuid')
  accountId: string

  @Column('text')
  purpose: 'verify' | 'reset'

  @Column('text')
  tokenHash: string

  @Column('timestamptz')
  expiresAt: Date

  @Column('timestamptz', { nullable: true })
  usedAt: Date | null

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date
}

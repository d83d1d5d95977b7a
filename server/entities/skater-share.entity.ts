import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm'

/**
 * A skater profile opened to a coach (invited by e-mail, active once they accept) or to a shop (active at once).
 * Either side may end it; an ended share is kept for the record and grants nothing.
 */
@Entity()
export class SkaterShare {
  @PrimaryGeneratedColumn('uuid')
  id: string

  @Column('uuid')
  skaterProfileId: string

  @Column('text')
  kind: 'coach' | 'shop'

  @Column('text', { nullable: true })
  coachEmail: string | null

  @Column('uuid', { nullable: true })
  coachAccountId: string | null

  @Column('uuid', { nullable: true })
  shopId: string | null

  @Column('text')
  status: 'pending' | 'active' | 'ended'

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date

  @Column('timestamptz', { nullable: true })
  acceptedAt: Date | null

  @Column('timestamptz', { nullable: true })
  endedAt: Date | null
}

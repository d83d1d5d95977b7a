import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm'

/** A shop admin's invitation to a technician, matched to the invitee by e-mail address. */
@Entity()
export class ShopInvitation {
  @PrimaryGeneratedColumn('uuid')
  id: string

  @Column('uuid')
  shopId: string

  @Column('text')
  email: string

  @Column('uuid', { nullable: true })
  invitedByAccountId: string | null

  @Column('text', { default: 'pending' })
  status: 'pending' | 'accepted' | 'withdrawn'

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date

  @Column('timestamptz', { nullable: true })
  answeredAt: Date | null
}

import { Column, CreateDateColumn, Entity, PrimaryColumn } from 'typeorm'

/** An account working at a shop: its admin (who created it) or a technician (who accepted an invitation). */
@Entity()
export class ShopMember {
  @PrimaryColumn('uuid')
  shopId: string

  @PrimaryColumn('uuid')
  accountId: string

  @Column('text')
  role: 'admin' | 'technician'

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date
}

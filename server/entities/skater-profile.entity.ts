import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm'

/**
 * A skater whose blades are kept. Owned by one account (the skater, or a parent managing several children);
 * coaches and shops reach it only through an active share, checked by `services/access.service.ts`.
 */
@Entity()
export class SkaterProfile {
  @PrimaryGeneratedColumn('uuid')
  id: string

  @Column('uuid')
  ownerAccountId: string

  @Column('text')
  name: string

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date
}

import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm'

/** A sharpening shop; its people are in `shop_members`. */
@Entity()
export class Shop {
  @PrimaryGeneratedColumn('uuid')
  id: string

  @Column('text')
  name: string

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date
}

import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm'

/** One sharpening of one blade, with the analyses taken before and after it when there are any. */
@Entity()
export class Sharpening {
  @PrimaryGeneratedColumn('uuid')
  id: string

  @Column('uuid')
  bladeId: string

  @Column('date')
  sharpenedOn: string

  @Column('text', { nullable: true })
  shop: string | null

  @Column('text', { nullable: true })
  technician: string | null

  /** Root radius of the hollow in sixteenths of an inch (7 = 7/16 in). */
  @Column('int', { nullable: true })
  rootRadiusSixteenths: number | null

  @Column('text', { nullable: true })
  notes: string | null

  @Column('uuid', { nullable: true })
  analysisBeforeId: string | null

  @Column('uuid', { nullable: true })
  analysisAfterId: string | null

  @Column('uuid', { nullable: true })
  recordedById: string | null

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date
}

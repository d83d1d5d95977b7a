import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm'
import type { BladeSide, Discipline } from '../../shared/schemas/blades'

/** One runner of a pair. `skaterProfileId` is copied from the pair so access checks need no join. */
@Entity()
export class Blade {
  @PrimaryGeneratedColumn('uuid')
  id: string

  @Column('uuid')
  pairId: string

  @Column('uuid')
  skaterProfileId: string

  @Column('text')
  side: BladeSide

  @Column('text')
  discipline: Discipline

  @Column('double precision')
  sizeIn: number

  @Column('text', { nullable: true })
  modelLabel: string | null

  @Column('date', { nullable: true })
  mountedOn: string | null

  /** 0 when registered new (its first analysis is then its baseline). */
  @Column('int', { default: 0 })
  sharpeningsAtRegistration: number

  @Column('text', { default: 'in_use' })
  status: 'in_use' | 'retired'

  @Column('text', { nullable: true })
  notes: string | null

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date
}

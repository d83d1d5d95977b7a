import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm'
import type { Discipline } from '../../shared/schemas/blades'

/** A pair of skates of one skater profile; its two blades are created with it. */
@Entity()
export class SkatePair {
  @PrimaryGeneratedColumn('uuid')
  id: string

  @Column('uuid')
  skaterProfileId: string

  @Column('text')
  label: string

  @Column('double precision')
  sizeIn: number

  @Column('text')
  discipline: Discipline

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date
}

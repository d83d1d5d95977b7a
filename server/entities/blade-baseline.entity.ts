import { Column, Entity, PrimaryColumn } from 'typeorm'

/** The reference analysis a technician marked for a blade registered mid-life (DESIGN.md §6). */
@Entity()
export class BladeBaseline {
  @PrimaryColumn('uuid')
  bladeId: string

  @Column('uuid')
  analysisId: string

  @Column('uuid', { nullable: true })
  markedById: string | null

  @Column('text')
  markedByName: string

  @Column('timestamptz')
  markedAt: Date
}

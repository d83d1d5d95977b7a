import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm'
import type { AnalysisResult } from '../../shared/schemas/analysis'

/**
 * A shop's saved new-condition profile of a blade model and size (DESIGN.md §6): a copy of the measured result, so
 * it stays the shop's reference after the customer's blade or share is gone.
 */
@Entity()
export class ReferenceProfile {
  @PrimaryGeneratedColumn('uuid')
  id: string

  @Column('uuid')
  shopId: string

  /** Model label as written on the blade, compared case- and space-insensitively. */
  @Column('text')
  modelLabel: string

  @Column('double precision')
  sizeIn: number

  @Column('jsonb')
  result: AnalysisResult

  @Column('uuid', { nullable: true })
  sourceAnalysisId: string | null

  @Column('text')
  savedByName: string

  @Column('timestamptz')
  savedAt: Date
}

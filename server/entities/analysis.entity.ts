import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm'
import type { AnalysisResult, Overrides } from '../../shared/schemas/analysis'
import type { AnalysisStatus, LandmarkChange } from '../../shared/schemas/analyses'

/** One measurement of one photo by one algorithm version; the worker fills it in, people may move its landmarks. */
// The naming strategy only appends an s; name the table so it reads "analyses".
@Entity('analyses')
export class Analysis {
  @PrimaryGeneratedColumn('uuid')
  id: string

  @Column('uuid')
  bladeId: string

  @Column('uuid')
  photoId: string

  @Column('text', { default: 'queued' })
  status: AnalysisStatus

  @Column('jsonb', { nullable: true })
  result: AnalysisResult | null

  @Column('text', { nullable: true })
  algorithmVersion: string | null

  @Column('jsonb', { nullable: true })
  overrides: Overrides | null

  @Column('jsonb', { default: () => `'[]'::jsonb` })
  landmarkChanges: LandmarkChange[]

  @Column('double precision', { nullable: true })
  checkBarMm: number | null

  @Column('text', { nullable: true })
  errorCode: string | null

  @Column('text', { nullable: true })
  errorMessage: string | null

  @Column('int', { default: 0 })
  attempts: number

  @Column('uuid', { nullable: true })
  requestedById: string | null

  @CreateDateColumn({ type: 'timestamptz' })
  queuedAt: Date

  @Column('timestamptz', { nullable: true })
  startedAt: Date | null

  @Column('timestamptz', { nullable: true })
  finishedAt: Date | null

  @Column('int', { nullable: true })
  durationMs: number | null
}

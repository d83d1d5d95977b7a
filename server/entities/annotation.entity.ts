import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm'

/** A note on an analysis, pinned along the blade or on the photo; a reply is an annotation with a parent. */
@Entity()
export class Annotation {
  @PrimaryGeneratedColumn('uuid')
  id: string

  @Column('uuid')
  analysisId: string

  @Column('uuid', { nullable: true })
  parentId: string | null

  @Column('uuid', { nullable: true })
  authorId: string | null

  @Column('text')
  authorName: string

  @Column('double precision', { nullable: true })
  alongMm: number | null

  @Column('double precision', { nullable: true })
  photoX: number | null

  @Column('double precision', { nullable: true })
  photoY: number | null

  @Column('text')
  text: string

  @Column('timestamptz', { nullable: true })
  resolvedAt: Date | null

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date
}

import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm'

/** A stored blade photo: turned upright, stripped of metadata, kept under a key derived from its sha256. */
@Entity()
export class Photo {
  @PrimaryGeneratedColumn('uuid')
  id: string

  @Column('uuid')
  bladeId: string

  @Column('text')
  storageKey: string

  /** Hex sha256 of the stored bytes (not of the upload, which still carried its metadata). */
  @Column('text')
  sha256: string

  @Column('text')
  contentType: string

  @Column('int')
  width: number

  @Column('int')
  height: number

  @Column('int')
  bytes: number

  @Column('uuid', { nullable: true })
  uploadedById: string | null

  @Column('timestamptz', { default: () => 'now()' })
  uploadedAt: Date
}

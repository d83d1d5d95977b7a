import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm'
import type { TargetMetric } from '../../shared/targets/bands'

/**
 * One band set in one layer above the platform's defaults: a shop's default, a skater's preference or a blade's
 * preference (exactly one of shopId, skaterProfileId, bladeId is set, matching `scope`), with who set it and when.
 */
@Entity()
export class TargetSetting {
  @PrimaryGeneratedColumn('uuid')
  id: string

  @Column('text')
  scope: 'shop' | 'skater' | 'blade'

  @Column('uuid', { nullable: true })
  shopId: string | null

  @Column('uuid', { nullable: true })
  skaterProfileId: string | null

  @Column('uuid', { nullable: true })
  bladeId: string | null

  @Column('text')
  metric: TargetMetric

  @Column('double precision', { nullable: true })
  minValue: number | null

  @Column('double precision', { nullable: true })
  maxValue: number | null

  @Column('text', { nullable: true })
  note: string | null

  @Column('uuid', { nullable: true })
  setById: string | null

  /** Kept as text so the history still reads when the account is gone. */
  @Column('text')
  setByName: string

  @Column('text', { nullable: true })
  setByRole: string | null

  @Column('timestamptz')
  setAt: Date
}

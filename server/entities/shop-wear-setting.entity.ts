import { Column, Entity, PrimaryColumn } from 'typeorm'

/** A shop's wear settings (DESIGN.md §6): the runner height at or below which it replaces a blade. */
@Entity()
export class ShopWearSetting {
  @PrimaryColumn('uuid')
  shopId: string

  /** mm, from the running surface to the runner's top edge. */
  @Column('double precision')
  minRunnerHeightMm: number

  @Column('text')
  setByName: string

  @Column('timestamptz')
  setAt: Date
}

import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm'
import type { Role } from '../../shared/schemas/auth'

/** A person who signs in. Roles are coarse; which skaters they see comes from ownership and shares. */
@Entity()
export class Account {
  @PrimaryGeneratedColumn('uuid')
  id: string

  /** Unique regardless of case (index on lower(email)); stored as typed, compared lower-cased. */
  @Column('text')
  email: string

  @Column('text')
  name: string

  @Column('text')
  passwordHash: string

  @Column('text', { array: true, default: () => "'{}'" })
  roles: Role[]

  @Column('timestamptz', { nullable: true })
  emailVerifiedAt: Date | null

  @Column('timestamptz', { nullable: true })
  disabledAt: Date | null

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date
}

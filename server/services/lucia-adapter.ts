import type { Adapter, DatabaseSession, DatabaseUser, Lucia } from 'lucia'
import type { DataSource } from 'typeorm'
import type { Role } from '../../shared/schemas/auth'

export interface SessionRow {
  id: string
  account_id: string
  expires_at: Date
  user_agent: string | null
  ip: string | null
  created_at: Date
}

interface AccountRow {
  email: string
  name: string
  roles: Role[]
  email_verified_at: Date | null
}

export interface AccountAttributes {
  email: string
  name: string
  roles: Role[]
  emailVerified: boolean
}

export interface SessionAttributes {
  userAgent: string | null
  ip: string | null
  createdAt: Date
}

declare module 'lucia' {
  interface Register {
    Lucia: Lucia<SessionAttributes, AccountAttributes>
    DatabaseUserAttributes: AccountAttributes
    DatabaseSessionAttributes: SessionAttributes
  }
}

function toSession(row: SessionRow): DatabaseSession {
  return {
    id: row.id,
    userId: row.account_id,
    expiresAt: new Date(row.expires_at),
    attributes: { userAgent: row.user_agent, ip: row.ip, createdAt: new Date(row.created_at) },
  }
}

function toUser(id: string, row: AccountRow): DatabaseUser {
  return {
    id,
    attributes: { email: row.email, name: row.name, roles: row.roles, emailVerified: row.email_verified_at !== null },
  }
}

/**
 * lucia's storage on our TypeORM DataSource (table `auth_sessions`). A disabled account yields no user, so lucia
 * drops the session on its next use even if the disabling request did not reach it.
 */
export class TypeOrmLuciaAdapter implements Adapter {
  constructor(private readonly db: DataSource) {}

  async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const rows: (SessionRow & AccountRow & { disabled_at: Date | null })[] = await this.db.query(
      `SELECT s.*, a.email, a.name, a.roles, a.email_verified_at, a.disabled_at
         FROM auth_sessions s JOIN accounts a ON a.id = s.account_id WHERE s.id = $1`,
      [sessionId],
    )
    const row = rows[0]
    if (!row) return [null, null]
    return [toSession(row), row.disabled_at ? null : toUser(row.account_id, row)]
  }

  async getUserSessions(userId: string): Promise<DatabaseSession[]> {
    const rows: SessionRow[] = await this.db.query(`SELECT * FROM auth_sessions WHERE account_id = $1 ORDER BY created_at`, [userId])
    return rows.map(toSession)
  }

  async setSession(session: DatabaseSession): Promise<void> {
    await this.db.query(
      `INSERT INTO auth_sessions (id, account_id, expires_at, user_agent, ip, created_at) VALUES ($1, $2, $3, $4, $5, $6)`,
      [session.id, session.userId, session.expiresAt, session.attributes.userAgent, session.attributes.ip, session.attributes.createdAt],
    )
  }

  async updateSessionExpiration(sessionId: string, expiresAt: Date): Promise<void> {
    await this.db.query(`UPDATE auth_sessions SET expires_at = $2 WHERE id = $1`, [sessionId, expiresAt])
  }

  async deleteSession(sessionId: string): Promise<void> {
    await this.db.query(`DELETE FROM auth_sessions WHERE id = $1`, [sessionId])
  }

  async deleteUserSessions(userId: string): Promise<void> {
    await this.db.query(`DELETE FROM auth_sessions WHERE account_id = $1`, [userId])
  }

  async deleteExpiredSessions(): Promise<void> {
    await this.db.query(`DELETE FROM auth_sessions WHERE expires_at <= now()`)
  }
}

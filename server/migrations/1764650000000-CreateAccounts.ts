import type { MigrationInterface, QueryRunner } from 'typeorm'

/** Accounts, their sessions (lucia) and the single-use e-mail tokens for verification and password reset. */
export class CreateAccounts1764650000000 implements MigrationInterface {
  name = 'CreateAccounts1764650000000'

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`CREATE EXTENSION IF NOT EXISTS pgcrypto`)
    await queryRunner.query(`
      CREATE TABLE "accounts" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "email" text NOT NULL,
        "name" text NOT NULL,
        "password_hash" text NOT NULL,
        "roles" text[] NOT NULL DEFAULT '{}',
        "email_verified_at" timestamptz,
        "disabled_at" timestamptz,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`)
    await queryRunner.query(`CREATE UNIQUE INDEX "accounts_email_key" ON "accounts" (lower("email"))`)
    await queryRunner.query(`
      CREATE TABLE "auth_sessions" (
        "id" text PRIMARY KEY,
        "account_id" uuid NOT NULL REFERENCES "accounts" ("id") ON DELETE CASCADE,
        "expires_at" timestamptz NOT NULL,
        "user_agent" text,
        "ip" text,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`)
    await queryRunner.query(`CREATE INDEX "auth_sessions_account_idx" ON "auth_sessions" ("account_id")`)
    await queryRunner.query(`
      CREATE TABLE "email_tokens" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "account_id" uuid NOT NULL REFERENCES "accounts" ("id") ON DELETE CASCADE,
        "purpose" text NOT NULL CHECK ("purpose" IN ('verify', 'reset')),
        "token_hash" text NOT NULL UNIQUE,
        "expires_at" timestamptz NOT NULL,
        "used_at" timestamptz,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`)
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP TABLE "email_tokens"`)
    await queryRunner.query(`DROP TABLE "auth_sessions"`)
    await queryRunner.query(`DROP TABLE "accounts"`)
  }
}

import type { MigrationInterface, QueryRunner } from 'typeorm'

/** Skater profiles, shops with their members and invitations, and the shares that open a profile to a coach or shop. */
export class CreateSkatersShopsShares1764650100000 implements MigrationInterface {
  name = 'CreateSkatersShopsShares1764650100000'

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE "skater_profiles" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "owner_account_id" uuid NOT NULL REFERENCES "accounts" ("id") ON DELETE CASCADE,
        "name" text NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`)
    await queryRunner.query(`CREATE INDEX "skater_profiles_owner_idx" ON "skater_profiles" ("owner_account_id")`)
    await queryRunner.query(`
      CREATE TABLE "shops" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "name" text NOT NULL,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`)
    await queryRunner.query(`
      CREATE TABLE "shop_members" (
        "shop_id" uuid NOT NULL REFERENCES "shops" ("id") ON DELETE CASCADE,
        "account_id" uuid NOT NULL REFERENCES "accounts" ("id") ON DELETE CASCADE,
        "role" text NOT NULL CHECK ("role" IN ('admin', 'technician')),
        "created_at" timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY ("shop_id", "account_id")
      )`)
    await queryRunner.query(`CREATE INDEX "shop_members_account_idx" ON "shop_members" ("account_id")`)
    await queryRunner.query(`
      CREATE TABLE "shop_invitations" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "shop_id" uuid NOT NULL REFERENCES "shops" ("id") ON DELETE CASCADE,
        "email" text NOT NULL,
        "invited_by_account_id" uuid REFERENCES "accounts" ("id") ON DELETE SET NULL,
        "status" text NOT NULL DEFAULT 'pending' CHECK ("status" IN ('pending', 'accepted', 'withdrawn')),
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "answered_at" timestamptz
      )`)
    await queryRunner.query(`CREATE INDEX "shop_invitations_email_idx" ON "shop_invitations" (lower("email"))`)
    await queryRunner.query(`
      CREATE TABLE "skater_shares" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "skater_profile_id" uuid NOT NULL REFERENCES "skater_profiles" ("id") ON DELETE CASCADE,
        "kind" text NOT NULL CHECK ("kind" IN ('coach', 'shop')),
        "coach_email" text,
        "coach_account_id" uuid REFERENCES "accounts" ("id") ON DELETE CASCADE,
        "shop_id" uuid REFERENCES "shops" ("id") ON DELETE CASCADE,
        "status" text NOT NULL CHECK ("status" IN ('pending', 'active', 'ended')),
        "created_at" timestamptz NOT NULL DEFAULT now(),
        "accepted_at" timestamptz,
        "ended_at" timestamptz,
        CHECK (("kind" = 'coach' AND "coach_email" IS NOT NULL) OR ("kind" = 'shop' AND "shop_id" IS NOT NULL))
      )`)
    await queryRunner.query(`CREATE INDEX "skater_shares_profile_idx" ON "skater_shares" ("skater_profile_id")`)
    await queryRunner.query(`CREATE INDEX "skater_shares_coach_idx" ON "skater_shares" ("coach_account_id") WHERE "status" = 'active'`)
    await queryRunner.query(`CREATE INDEX "skater_shares_shop_idx" ON "skater_shares" ("shop_id") WHERE "status" = 'active'`)
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP TABLE "skater_shares"`)
    await queryRunner.query(`DROP TABLE "shop_invitations"`)
    await queryRunner.query(`DROP TABLE "shop_members"`)
    await queryRunner.query(`DROP TABLE "shops"`)
    await queryRunner.query(`DROP TABLE "skater_profiles"`)
  }
}

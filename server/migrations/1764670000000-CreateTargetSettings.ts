import type { MigrationInterface, QueryRunner } from 'typeorm'

/** Target bands set by shops (their defaults), and by skaters and coaches (preferences per skater or per blade). */
export class CreateTargetSettings1764670000000 implements MigrationInterface {
  name = 'CreateTargetSettings1764670000000'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "target_settings" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "scope" text NOT NULL CHECK ("scope" IN ('shop', 'skater', 'blade')),
        "shop_id" uuid REFERENCES "shops" ("id") ON DELETE CASCADE,
        "skater_profile_id" uuid REFERENCES "skater_profiles" ("id") ON DELETE CASCADE,
        "blade_id" uuid REFERENCES "blades" ("id") ON DELETE CASCADE,
        "metric" text NOT NULL,
        "min_value" double precision,
        "max_value" double precision,
        "note" text,
        "set_by_id" uuid REFERENCES "accounts" ("id") ON DELETE SET NULL,
        "set_by_name" text NOT NULL,
        "set_by_role" text,
        "set_at" timestamptz NOT NULL DEFAULT now(),
        CHECK ("min_value" IS NOT NULL OR "max_value" IS NOT NULL),
        CHECK ("min_value" IS NULL OR "max_value" IS NULL OR "min_value" <= "max_value"),
        CHECK (("scope" = 'shop') = ("shop_id" IS NOT NULL)
           AND ("scope" = 'skater') = ("skater_profile_id" IS NOT NULL)
           AND ("scope" = 'blade') = ("blade_id" IS NOT NULL))
      )`)
    await q.query(`CREATE UNIQUE INDEX "target_settings_shop_uq" ON "target_settings" ("shop_id", "metric") WHERE "scope" = 'shop'`)
    await q.query(`CREATE UNIQUE INDEX "target_settings_skater_uq" ON "target_settings" ("skater_profile_id", "metric") WHERE "scope" = 'skater'`)
    await q.query(`CREATE UNIQUE INDEX "target_settings_blade_uq" ON "target_settings" ("blade_id", "metric") WHERE "scope" = 'blade'`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "target_settings"`)
  }
}

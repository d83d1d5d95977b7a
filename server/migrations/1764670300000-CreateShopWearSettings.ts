import type { MigrationInterface, QueryRunner } from 'typeorm'

/** Each shop's minimum runner height, the replace threshold of the wear rule. */
export class CreateShopWearSettings1764670300000 implements MigrationInterface {
  name = 'CreateShopWearSettings1764670300000'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "shop_wear_settings" (
        "shop_id" uuid PRIMARY KEY REFERENCES "shops" ("id") ON DELETE CASCADE,
        "min_runner_height_mm" double precision NOT NULL CHECK ("min_runner_height_mm" > 0),
        "set_by_name" text NOT NULL,
        "set_at" timestamptz NOT NULL DEFAULT now()
      )`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "shop_wear_settings"`)
  }
}

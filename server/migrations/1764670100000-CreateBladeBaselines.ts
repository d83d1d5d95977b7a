import type { MigrationInterface, QueryRunner } from 'typeorm'

/** A blade's marked reference analysis; without one, a blade registered new is compared with its first analysis. */
export class CreateBladeBaselines1764670100000 implements MigrationInterface {
  name = 'CreateBladeBaselines1764670100000'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "blade_baselines" (
        "blade_id" uuid PRIMARY KEY REFERENCES "blades" ("id") ON DELETE CASCADE,
        "analysis_id" uuid NOT NULL REFERENCES "analyses" ("id") ON DELETE CASCADE,
        "marked_by_id" uuid REFERENCES "accounts" ("id") ON DELETE SET NULL,
        "marked_by_name" text NOT NULL,
        "marked_at" timestamptz NOT NULL DEFAULT now()
      )`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "blade_baselines"`)
  }
}

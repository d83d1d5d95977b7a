import type { MigrationInterface, QueryRunner } from 'typeorm'

/** Shops' reference profiles: one new-condition profile per blade model and size per shop. */
export class CreateReferenceProfiles1764670200000 implements MigrationInterface {
  name = 'CreateReferenceProfiles1764670200000'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE "reference_profiles" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "shop_id" uuid NOT NULL REFERENCES "shops" ("id") ON DELETE CASCADE,
        "model_label" text NOT NULL,
        "size_in" double precision NOT NULL,
        "result" jsonb NOT NULL,
        "source_analysis_id" uuid REFERENCES "analyses" ("id") ON DELETE SET NULL,
        "saved_by_name" text NOT NULL,
        "saved_at" timestamptz NOT NULL DEFAULT now()
      )`)
    await q.query(`CREATE UNIQUE INDEX "reference_profiles_model_uq" ON "reference_profiles" ("shop_id", lower(btrim("model_label")), "size_in")`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "reference_profiles"`)
  }
}

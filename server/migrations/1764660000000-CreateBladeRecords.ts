import type { MigrationInterface, QueryRunner } from 'typeorm'

/**
 * Pairs, blades, photos, analyses, annotations and sharpenings, hanging off the accounts' skater profiles. People
 * who uploaded or wrote something may leave: their ids are kept nullable and annotations keep the author's name.
 */
export class CreateBladeRecords1764660000000 implements MigrationInterface {
  name = 'CreateBladeRecords1764660000000'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE EXTENSION IF NOT EXISTS pgcrypto`)
    await q.query(`
      CREATE TABLE "skate_pairs" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "skater_profile_id" uuid NOT NULL REFERENCES "skater_profiles" ("id") ON DELETE CASCADE,
        "label" text NOT NULL,
        "size_in" double precision NOT NULL,
        "discipline" text NOT NULL CHECK ("discipline" IN ('freestyle', 'dance', 'pairs', 'synchro')),
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`)
    await q.query(`CREATE INDEX "skate_pairs_skater_idx" ON "skate_pairs" ("skater_profile_id")`)
    await q.query(`
      CREATE TABLE "blades" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "pair_id" uuid NOT NULL REFERENCES "skate_pairs" ("id") ON DELETE CASCADE,
        "skater_profile_id" uuid NOT NULL REFERENCES "skater_profiles" ("id") ON DELETE CASCADE,
        "side" text NOT NULL CHECK ("side" IN ('left', 'right')),
        "discipline" text NOT NULL CHECK ("discipline" IN ('freestyle', 'dance', 'pairs', 'synchro')),
        "size_in" double precision NOT NULL,
        "model_label" text,
        "mounted_on" date,
        "sharpenings_at_registration" int NOT NULL DEFAULT 0,
        "status" text NOT NULL DEFAULT 'in_use' CHECK ("status" IN ('in_use', 'retired')),
        "notes" text,
        "created_at" timestamptz NOT NULL DEFAULT now(),
        UNIQUE ("pair_id", "side")
      )`)
    await q.query(`CREATE INDEX "blades_skater_idx" ON "blades" ("skater_profile_id")`)
    await q.query(`
      CREATE TABLE "photos" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "blade_id" uuid NOT NULL REFERENCES "blades" ("id") ON DELETE CASCADE,
        "storage_key" text NOT NULL,
        "sha256" text NOT NULL,
        "content_type" text NOT NULL,
        "width" int NOT NULL,
        "height" int NOT NULL,
        "bytes" int NOT NULL,
        "uploaded_by_id" uuid REFERENCES "accounts" ("id") ON DELETE SET NULL,
        "uploaded_at" timestamptz NOT NULL DEFAULT now()
      )`)
    await q.query(`CREATE INDEX "photos_storage_key_idx" ON "photos" ("storage_key")`)
    await q.query(`
      CREATE TABLE "analyses" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "blade_id" uuid NOT NULL REFERENCES "blades" ("id") ON DELETE CASCADE,
        "photo_id" uuid NOT NULL REFERENCES "photos" ("id") ON DELETE CASCADE,
        "status" text NOT NULL DEFAULT 'queued'
          CHECK ("status" IN ('queued', 'running', 'measured', 'refused', 'failed')),
        "result" jsonb,
        "algorithm_version" text,
        "overrides" jsonb,
        "landmark_changes" jsonb NOT NULL DEFAULT '[]'::jsonb,
        "check_bar_mm" double precision,
        "error_code" text,
        "error_message" text,
        "attempts" int NOT NULL DEFAULT 0,
        "requested_by_id" uuid REFERENCES "accounts" ("id") ON DELETE SET NULL,
        "queued_at" timestamptz NOT NULL DEFAULT now(),
        "started_at" timestamptz,
        "finished_at" timestamptz,
        "duration_ms" int
      )`)
    await q.query(`CREATE INDEX "analyses_blade_idx" ON "analyses" ("blade_id", "queued_at")`)
    await q.query(`
      CREATE TABLE "annotations" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "analysis_id" uuid NOT NULL REFERENCES "analyses" ("id") ON DELETE CASCADE,
        "parent_id" uuid REFERENCES "annotations" ("id") ON DELETE CASCADE,
        "author_id" uuid REFERENCES "accounts" ("id") ON DELETE SET NULL,
        "author_name" text NOT NULL,
        "along_mm" double precision,
        "photo_x" double precision,
        "photo_y" double precision,
        "text" text NOT NULL,
        "resolved_at" timestamptz,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`)
    await q.query(`CREATE INDEX "annotations_analysis_idx" ON "annotations" ("analysis_id")`)
    await q.query(`
      CREATE TABLE "sharpenings" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "blade_id" uuid NOT NULL REFERENCES "blades" ("id") ON DELETE CASCADE,
        "sharpened_on" date NOT NULL,
        "shop" text,
        "technician" text,
        "root_radius_sixteenths" int,
        "notes" text,
        "analysis_before_id" uuid REFERENCES "analyses" ("id") ON DELETE SET NULL,
        "analysis_after_id" uuid REFERENCES "analyses" ("id") ON DELETE SET NULL,
        "recorded_by_id" uuid REFERENCES "accounts" ("id") ON DELETE SET NULL,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`)
    await q.query(`CREATE INDEX "sharpenings_blade_idx" ON "sharpenings" ("blade_id", "sharpened_on")`)
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of ['sharpenings', 'annotations', 'analyses', 'photos', 'blades', 'skate_pairs']) {
      await q.query(`DROP TABLE "${table}"`)
    }
  }
}

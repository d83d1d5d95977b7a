import type { MigrationInterface, QueryRunner } from 'typeorm'

/** Records which seed steps have run, so `npm start` seeds demo data once and never twice. */
export class CreateSeedRuns1764640000000 implements MigrationInterface {
  name = 'CreateSeedRuns1764640000000'

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE "seed_runs" ("name" text PRIMARY KEY, "ran_at" timestamptz NOT NULL DEFAULT now())`,
    )
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP TABLE "seed_runs"`)
  }
}

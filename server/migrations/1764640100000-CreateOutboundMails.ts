import type { MigrationInterface, QueryRunner } from 'typeorm'

export class CreateOutboundMails1764640100000 implements MigrationInterface {
  name = 'CreateOutboundMails1764640100000'

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`CREATE EXTENSION IF NOT EXISTS pgcrypto`)
    await queryRunner.query(`
      CREATE TABLE "outbound_mails" (
        "id" uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "to" text NOT NULL,
        "subject" text NOT NULL,
        "text" text NOT NULL,
        "html" text,
        "status" text NOT NULL DEFAULT 'queued',
        "attempts" int NOT NULL DEFAULT 0,
        "sent_at" timestamptz,
        "created_at" timestamptz NOT NULL DEFAULT now()
      )`)
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP TABLE "outbound_mails"`)
  }
}

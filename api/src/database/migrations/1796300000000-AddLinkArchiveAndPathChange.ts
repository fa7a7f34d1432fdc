import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Archiving and "changed since approval" on links, and the trail entries that record them
 * (renamed, path_changed, archived, restored).
 */
export class AddLinkArchiveAndPathChange1796300000000 implements MigrationInterface {
  name = 'AddLinkArchiveAndPathChange1796300000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "link" ADD "path_changed_at" TIMESTAMP WITH TIME ZONE`);
    await queryRunner.query(`ALTER TABLE "link" ADD "archived_at" TIMESTAMP WITH TIME ZONE`);
    // a new enum type rather than ALTER TYPE … ADD VALUE, which cannot be undone and whose values
    // cannot be used in the transaction that adds them
    await queryRunner.query(`ALTER TYPE "public"."review_action" RENAME TO "review_action_old"`);
    await queryRunner.query(`CREATE TYPE "public"."review_action" AS ENUM('submit', 'approve', 'return', 'install', 'renamed', 'path_changed', 'archived', 'restored')`);
    await queryRunner.query(`ALTER TABLE "link_review" ALTER COLUMN "action" TYPE "public"."review_action" USING "action"::"text"::"public"."review_action"`);
    await queryRunner.query(`DROP TYPE "public"."review_action_old"`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    // the older schema has no room for the new trail entries: they go with it
    await queryRunner.query(`DELETE FROM "link_review" WHERE "action" IN ('renamed', 'path_changed', 'archived', 'restored')`);
    await queryRunner.query(`CREATE TYPE "public"."review_action_old" AS ENUM('submit', 'approve', 'return', 'install')`);
    await queryRunner.query(`ALTER TABLE "link_review" ALTER COLUMN "action" TYPE "public"."review_action_old" USING "action"::"text"::"public"."review_action_old"`);
    await queryRunner.query(`DROP TYPE "public"."review_action"`);
    await queryRunner.query(`ALTER TYPE "public"."review_action_old" RENAME TO "review_action"`);
    await queryRunner.query(`ALTER TABLE "link" DROP COLUMN "archived_at"`);
    await queryRunner.query(`ALTER TABLE "link" DROP COLUMN "path_changed_at"`);
  }
}

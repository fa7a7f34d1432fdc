import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Variants of a revision: one row per named alternative design, with the budget and engine version
 * of its own, keyed by (revision, position) and deleted with its revision. A table rather than a
 * jsonb list on link_revision so that the revision rows (read for every history, list and
 * conflict answer) stay as they are, and each variant carries its engine version as a column, as a
 * revision does.
 */
export class AddRevisionVariants1796414178325 implements MigrationInterface {
  name = 'AddRevisionVariants1796414178325';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE "link_revision_variant" ("revision_id" uuid NOT NULL, "position" smallint NOT NULL, "name" character varying(100) NOT NULL, "design" jsonb NOT NULL, "budget" jsonb NOT NULL, "link_core_version" character varying(40) NOT NULL, CONSTRAINT "CHK_link_revision_variant_position" CHECK ("position" >= 0 AND "position" < 8), CONSTRAINT "PK_5d4bfe23bead4b7fe410c04400a" PRIMARY KEY ("revision_id", "position"))`,
    );
    await queryRunner.query(
      `ALTER TABLE "link_revision_variant" ADD CONSTRAINT "FK_c628f217beed5a35a698742e66b" FOREIGN KEY ("revision_id") REFERENCES "link_revision"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "link_revision_variant" DROP CONSTRAINT "FK_c628f217beed5a35a698742e66b"`);
    await queryRunner.query(`DROP TABLE "link_revision_variant"`);
  }
}

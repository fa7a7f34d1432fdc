import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The organisation's defaults for new links (required margin, fade probability, visibility
 * definition, distance unit) and the retirement date of a catalogue model.
 */
export class AddOrganisationSettingsAndRetiredEquipment1796500000000 implements MigrationInterface {
  name = 'AddOrganisationSettingsAndRetiredEquipment1796500000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "organisation" ADD "required_margin_db" double precision NOT NULL DEFAULT '3'`);
    await queryRunner.query(`ALTER TABLE "organisation" ADD "fade_probability" double precision NOT NULL DEFAULT '0.001'`);
    await queryRunner.query(`ALTER TABLE "organisation" ADD "visibility_definition" character varying(40) NOT NULL DEFAULT 'contrast-2-percent'`);
    await queryRunner.query(`ALTER TABLE "organisation" ADD "distance_unit" character varying(8) NOT NULL DEFAULT 'km'`);
    await queryRunner.query(`ALTER TABLE "equipment_model" ADD "retired_at" TIMESTAMP WITH TIME ZONE`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "equipment_model" DROP COLUMN "retired_at"`);
    await queryRunner.query(`ALTER TABLE "organisation" DROP COLUMN "distance_unit"`);
    await queryRunner.query(`ALTER TABLE "organisation" DROP COLUMN "visibility_definition"`);
    await queryRunner.query(`ALTER TABLE "organisation" DROP COLUMN "fade_probability"`);
    await queryRunner.query(`ALTER TABLE "organisation" DROP COLUMN "required_margin_db"`);
  }
}

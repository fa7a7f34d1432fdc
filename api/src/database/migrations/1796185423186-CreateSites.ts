import { MigrationInterface, QueryRunner } from "typeorm";

export class CreateSites1796185423186 implements MigrationInterface {
    name = 'CreateSites1796185423186'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE "site" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "organisation_id" uuid NOT NULL, "name" character varying(200) NOT NULL, "latitude_deg" double precision NOT NULL, "longitude_deg" double precision NOT NULL, "ground_elevation_m" double precision NOT NULL, "mount_height_m" double precision NOT NULL, "notes" text NOT NULL DEFAULT '', "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "PK_635c0eeabda8862d5b0237b42b4" PRIMARY KEY ("id"))`);
        await queryRunner.query(`CREATE INDEX "IDX_9677adb539f4db320b0dce3087" ON "site"  ("organisation_id") `);
        await queryRunner.query(`ALTER TABLE "site" ADD CONSTRAINT "FK_9677adb539f4db320b0dce3087c" FOREIGN KEY ("organisation_id") REFERENCES "organisation"("id") ON DELETE CASCADE ON UPDATE NO ACTION`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "site" DROP CONSTRAINT "FK_9677adb539f4db320b0dce3087c"`);
        await queryRunner.query(`DROP INDEX "public"."IDX_9677adb539f4db320b0dce3087"`);
        await queryRunner.query(`DROP TABLE "site"`);
    }

}

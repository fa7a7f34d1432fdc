import { MigrationInterface, QueryRunner } from "typeorm";

export class CreateEquipmentLinksRevisionsReviews1796185633635 implements MigrationInterface {
    name = 'CreateEquipmentLinksRevisionsReviews1796185633635'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TYPE "public"."equipment_kind" AS ENUM('transmitter', 'receiver')`);
        await queryRunner.query(`CREATE TABLE "equipment_model" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "organisation_id" uuid NOT NULL, "kind" "public"."equipment_kind" NOT NULL, "name" character varying(200) NOT NULL, "maker" character varying(200) NOT NULL DEFAULT '', "notes" text NOT NULL DEFAULT '', "illustrative" boolean NOT NULL DEFAULT false, "spec" jsonb NOT NULL, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "PK_39964974a84f94689962c0245b5" PRIMARY KEY ("id"))`);
        await queryRunner.query(`CREATE INDEX "IDX_35ac2599e7177d6fc03370b450" ON "equipment_model"  ("organisation_id", "kind") `);
        await queryRunner.query(`CREATE TYPE "public"."link_status" AS ENUM('draft', 'in_review', 'approved', 'installed')`);
        await queryRunner.query(`CREATE TABLE "link" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "organisation_id" uuid NOT NULL, "name" character varying(200) NOT NULL, "status" "public"."link_status" NOT NULL DEFAULT 'draft', "owner_id" uuid NOT NULL, "site_a_id" uuid, "site_b_id" uuid, "latest_revision" integer NOT NULL, "latest_link_margin_db" double precision NOT NULL, "latest_received_power_dbm" double precision NOT NULL, "latest_range_m" double precision NOT NULL, "latest_wavelength_m" double precision NOT NULL, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "PK_26206fb7186da72fbb9eaa3fac9" PRIMARY KEY ("id"))`);
        await queryRunner.query(`CREATE INDEX "IDX_faf52aecc849ad5b6d03dc6386" ON "link"  ("owner_id") `);
        await queryRunner.query(`CREATE INDEX "IDX_560f2b03958eb40ee9db5852a2" ON "link"  ("site_a_id") `);
        await queryRunner.query(`CREATE INDEX "IDX_11f584e3e6a5eaafcde349ef5f" ON "link"  ("site_b_id") `);
        await queryRunner.query(`CREATE INDEX "IDX_4eb986d347a964c3c727ea776e" ON "link"  ("organisation_id", "updated_at") `);
        await queryRunner.query(`CREATE TABLE "link_revision" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "link_id" uuid NOT NULL, "revision_number" integer NOT NULL, "design" jsonb NOT NULL, "budget" jsonb NOT NULL, "link_core_version" character varying(40) NOT NULL, "note" text NOT NULL DEFAULT '', "author_id" uuid NOT NULL, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "UQ_link_revision_link_number" UNIQUE ("link_id", "revision_number"), CONSTRAINT "PK_f41a8a454ac702878dbdfc1291e" PRIMARY KEY ("id"))`);
        await queryRunner.query(`CREATE TYPE "public"."review_action" AS ENUM('submit', 'approve', 'return', 'install')`);
        await queryRunner.query(`CREATE TYPE "public"."link_review_status" AS ENUM('draft', 'in_review', 'approved', 'installed')`);
        await queryRunner.query(`CREATE TABLE "link_review" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "link_id" uuid NOT NULL, "revision_number" integer NOT NULL, "action" "public"."review_action" NOT NULL, "from_status" "public"."link_review_status" NOT NULL, "to_status" "public"."link_review_status" NOT NULL, "comment" text NOT NULL DEFAULT '', "actor_id" uuid NOT NULL, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "PK_8c5d73a6b0ffbadc3c3aafdd40b" PRIMARY KEY ("id"))`);
        await queryRunner.query(`CREATE INDEX "IDX_db96df2e8c686a10e87237eacd" ON "link_review"  ("link_id", "created_at") `);
        await queryRunner.query(`ALTER TABLE "equipment_model" ADD CONSTRAINT "FK_cfaf9b5a43bcd5f318859a8f3e2" FOREIGN KEY ("organisation_id") REFERENCES "organisation"("id") ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE "link" ADD CONSTRAINT "FK_aecde21e7328fac898ab90cc454" FOREIGN KEY ("organisation_id") REFERENCES "organisation"("id") ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE "link" ADD CONSTRAINT "FK_faf52aecc849ad5b6d03dc63864" FOREIGN KEY ("owner_id") REFERENCES "app_user"("id") ON DELETE NO ACTION ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE "link" ADD CONSTRAINT "FK_560f2b03958eb40ee9db5852a2d" FOREIGN KEY ("site_a_id") REFERENCES "site"("id") ON DELETE NO ACTION ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE "link" ADD CONSTRAINT "FK_11f584e3e6a5eaafcde349ef5f7" FOREIGN KEY ("site_b_id") REFERENCES "site"("id") ON DELETE NO ACTION ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE "link_revision" ADD CONSTRAINT "FK_88e464bd1ef31269c9e5d03aaf7" FOREIGN KEY ("link_id") REFERENCES "link"("id") ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE "link_revision" ADD CONSTRAINT "FK_081aa12d068e9c4ce0153494310" FOREIGN KEY ("author_id") REFERENCES "app_user"("id") ON DELETE NO ACTION ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE "link_review" ADD CONSTRAINT "FK_e475373b84190872e3d16a99715" FOREIGN KEY ("link_id") REFERENCES "link"("id") ON DELETE CASCADE ON UPDATE NO ACTION`);
        await queryRunner.query(`ALTER TABLE "link_review" ADD CONSTRAINT "FK_f3a952f9caa4dc9fab72c6e2c9f" FOREIGN KEY ("actor_id") REFERENCES "app_user"("id") ON DELETE NO ACTION ON UPDATE NO ACTION`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "link_review" DROP CONSTRAINT "FK_f3a952f9caa4dc9fab72c6e2c9f"`);
        await queryRunner.query(`ALTER TABLE "link_review" DROP CONSTRAINT "FK_e475373b84190872e3d16a99715"`);
        await queryRunner.query(`ALTER TABLE "link_revision" DROP CONSTRAINT "FK_081aa12d068e9c4ce0153494310"`);
        await queryRunner.query(`ALTER TABLE "link_revision" DROP CONSTRAINT "FK_88e464bd1ef31269c9e5d03aaf7"`);
        await queryRunner.query(`ALTER TABLE "link" DROP CONSTRAINT "FK_11f584e3e6a5eaafcde349ef5f7"`);
        await queryRunner.query(`ALTER TABLE "link" DROP CONSTRAINT "FK_560f2b03958eb40ee9db5852a2d"`);
        await queryRunner.query(`ALTER TABLE "link" DROP CONSTRAINT "FK_faf52aecc849ad5b6d03dc63864"`);
        await queryRunner.query(`ALTER TABLE "link" DROP CONSTRAINT "FK_aecde21e7328fac898ab90cc454"`);
        await queryRunner.query(`ALTER TABLE "equipment_model" DROP CONSTRAINT "FK_cfaf9b5a43bcd5f318859a8f3e2"`);
        await queryRunner.query(`DROP INDEX "public"."IDX_db96df2e8c686a10e87237eacd"`);
        await queryRunner.query(`DROP TABLE "link_review"`);
        await queryRunner.query(`DROP TYPE "public"."link_review_status"`);
        await queryRunner.query(`DROP TYPE "public"."review_action"`);
        await queryRunner.query(`DROP TABLE "link_revision"`);
        await queryRunner.query(`DROP INDEX "public"."IDX_4eb986d347a964c3c727ea776e"`);
        await queryRunner.query(`DROP INDEX "public"."IDX_11f584e3e6a5eaafcde349ef5f"`);
        await queryRunner.query(`DROP INDEX "public"."IDX_560f2b03958eb40ee9db5852a2"`);
        await queryRunner.query(`DROP INDEX "public"."IDX_faf52aecc849ad5b6d03dc6386"`);
        await queryRunner.query(`DROP TABLE "link"`);
        await queryRunner.query(`DROP TYPE "public"."link_status"`);
        await queryRunner.query(`DROP INDEX "public"."IDX_35ac2599e7177d6fc03370b450"`);
        await queryRunner.query(`DROP TABLE "equipment_model"`);
        await queryRunner.query(`DROP TYPE "public"."equipment_kind"`);
    }

}

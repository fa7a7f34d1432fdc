import { MigrationInterface, QueryRunner } from "typeorm";

export class CreateOrganisationsAndUsers1796185289124 implements MigrationInterface {
    name = 'CreateOrganisationsAndUsers1796185289124'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE "organisation" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "name" character varying(200) NOT NULL, "slug" character varying(80) NOT NULL, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "UQ_b800a0efd2f9f19719d0c4d793d" UNIQUE ("slug"), CONSTRAINT "PK_c725ae234ef1b74cce43d2d00c1" PRIMARY KEY ("id"))`);
        await queryRunner.query(`CREATE TYPE "public"."user_role" AS ENUM('admin', 'engineer', 'reviewer', 'installer')`);
        await queryRunner.query(`CREATE TABLE "app_user" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "organisation_id" uuid NOT NULL, "email" character varying(320) NOT NULL, "display_name" character varying(200) NOT NULL, "password_hash" character varying(255) NOT NULL, "role" "public"."user_role" NOT NULL, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "UQ_3fa909d0e37c531ebc237703391" UNIQUE ("email"), CONSTRAINT "PK_22a5c4a3d9b2fb8e4e73fc4ada1" PRIMARY KEY ("id"))`);
        await queryRunner.query(`CREATE INDEX "IDX_6fa42e978fa7d7adc32736e26f" ON "app_user"  ("organisation_id") `);
        await queryRunner.query(`ALTER TABLE "app_user" ADD CONSTRAINT "FK_6fa42e978fa7d7adc32736e26fd" FOREIGN KEY ("organisation_id") REFERENCES "organisation"("id") ON DELETE CASCADE ON UPDATE NO ACTION`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "app_user" DROP CONSTRAINT "FK_6fa42e978fa7d7adc32736e26fd"`);
        await queryRunner.query(`DROP INDEX "public"."IDX_6fa42e978fa7d7adc32736e26f"`);
        await queryRunner.query(`DROP TABLE "app_user"`);
        await queryRunner.query(`DROP TYPE "public"."user_role"`);
        await queryRunner.query(`DROP TABLE "organisation"`);
    }

}

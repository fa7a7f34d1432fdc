import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Weather data sets and their records, and the imports that fill them: an import holds its uploaded
 * file in chunks until its job has run (the job queue's own tables are pg-boss's, in its schema).
 */
export class CreateWeatherDatasetsAndImports1796415183158 implements MigrationInterface {
  name = 'CreateWeatherDatasetsAndImports1796415183158';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`CREATE TYPE "public"."visibility_definition" AS ENUM('contrast-2-percent', 'mor-5-percent')`);
    await queryRunner.query(`CREATE TYPE "public"."visibility_unit" AS ENUM('m', 'km', 'mi', 'ft')`);
    await queryRunner.query(`CREATE TABLE "weather_dataset" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "organisation_id" uuid NOT NULL, "site_id" uuid, "name" character varying(200) NOT NULL, "notes" text NOT NULL DEFAULT '', "visibility_definition" "public"."visibility_definition" NOT NULL, "source_unit" "public"."visibility_unit", "source_file_name" character varying(255), "mapping" jsonb, "record_count" integer NOT NULL, "missing_visibility_count" integer NOT NULL DEFAULT '0', "first_observed_at" TIMESTAMP WITH TIME ZONE, "last_observed_at" TIMESTAMP WITH TIME ZONE, "has_rain_rate" boolean NOT NULL DEFAULT false, "has_snow_rate" boolean NOT NULL DEFAULT false, "has_temperature" boolean NOT NULL DEFAULT false, "has_cn2" boolean NOT NULL DEFAULT false, "invented" boolean NOT NULL DEFAULT false, "created_by_id" uuid, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "PK_76854f6b8b8c0b38ae6a7671af6" PRIMARY KEY ("id"))`);
    await queryRunner.query(`CREATE INDEX "IDX_e998ea2086e1b155efac0e23dd" ON "weather_dataset"("organisation_id")`);
    await queryRunner.query(`CREATE INDEX "IDX_54129661536f8d490df0452a15" ON "weather_dataset"("site_id")`);
    await queryRunner.query(`CREATE TABLE "weather_record" ("dataset_id" uuid NOT NULL, "observed_at" TIMESTAMP WITH TIME ZONE NOT NULL, "visibility_m" double precision, "rain_rate_mm_per_h" double precision, "snow_rate_mm_per_h" double precision, "temperature_c" double precision, "cn2" double precision, CONSTRAINT "PK_447911c5db62150f67ad02be6e4" PRIMARY KEY ("dataset_id", "observed_at"))`);
    await queryRunner.query(`CREATE TYPE "public"."weather_import_state" AS ENUM('uploading', 'queued', 'running', 'succeeded', 'failed', 'cancelled')`);
    await queryRunner.query(`CREATE TYPE "public"."weather_row_error_policy" AS ENUM('reject', 'skip')`);
    await queryRunner.query(`CREATE TABLE "weather_import" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "organisation_id" uuid NOT NULL, "created_by_id" uuid, "state" "public"."weather_import_state" NOT NULL DEFAULT 'uploading', "name" character varying(200) NOT NULL DEFAULT '', "site_id" uuid, "notes" text NOT NULL DEFAULT '', "mapping" jsonb, "on_row_errors" "public"."weather_row_error_policy" NOT NULL DEFAULT 'reject', "file_name" character varying(255) NOT NULL DEFAULT '', "byte_count" bigint NOT NULL DEFAULT '0', "gzip" boolean NOT NULL DEFAULT false, "encoding" character varying(16) NOT NULL DEFAULT 'utf8', "delimiter" character varying(1) NOT NULL DEFAULT ',', "header" jsonb, "job_id" uuid, "attempt" integer NOT NULL DEFAULT '0', "bytes_read" bigint NOT NULL DEFAULT '0', "rows_read" integer NOT NULL DEFAULT '0', "heartbeat_at" TIMESTAMP WITH TIME ZONE, "cancel_requested" boolean NOT NULL DEFAULT false, "result" jsonb, "error" jsonb, "dataset_id" uuid, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "PK_9ae06f3999b2706db615a709e73" PRIMARY KEY ("id"))`);
    await queryRunner.query(`CREATE INDEX "IDX_1fb4e1b5bff2c217132a1af89b" ON "weather_import"("organisation_id")`);
    await queryRunner.query(`CREATE TABLE "weather_import_chunk" ("import_id" uuid NOT NULL, "seq" integer NOT NULL, "data" bytea NOT NULL, CONSTRAINT "PK_95868d3d5b5a53b3b5a95087576" PRIMARY KEY ("import_id", "seq"))`);
    await queryRunner.query(`ALTER TABLE "weather_dataset" ADD CONSTRAINT "FK_e998ea2086e1b155efac0e23dd1" FOREIGN KEY ("organisation_id") REFERENCES "organisation"("id") ON DELETE CASCADE ON UPDATE NO ACTION`);
    await queryRunner.query(`ALTER TABLE "weather_dataset" ADD CONSTRAINT "FK_54129661536f8d490df0452a15f" FOREIGN KEY ("site_id") REFERENCES "site"("id") ON DELETE SET NULL ON UPDATE NO ACTION`);
    await queryRunner.query(`ALTER TABLE "weather_dataset" ADD CONSTRAINT "FK_0605da45f729fd597aba83725e6" FOREIGN KEY ("created_by_id") REFERENCES "app_user"("id") ON DELETE SET NULL ON UPDATE NO ACTION`);
    await queryRunner.query(`ALTER TABLE "weather_record" ADD CONSTRAINT "FK_64e11241cb5066c2e494eb9eabd" FOREIGN KEY ("dataset_id") REFERENCES "weather_dataset"("id") ON DELETE CASCADE ON UPDATE NO ACTION`);
    await queryRunner.query(`ALTER TABLE "weather_import" ADD CONSTRAINT "FK_1fb4e1b5bff2c217132a1af89b6" FOREIGN KEY ("organisation_id") REFERENCES "organisation"("id") ON DELETE CASCADE ON UPDATE NO ACTION`);
    await queryRunner.query(`ALTER TABLE "weather_import" ADD CONSTRAINT "FK_9bf90e9a58e2e0557a3b97f4a8d" FOREIGN KEY ("created_by_id") REFERENCES "app_user"("id") ON DELETE SET NULL ON UPDATE NO ACTION`);
    await queryRunner.query(`ALTER TABLE "weather_import" ADD CONSTRAINT "FK_2085983e8ab6860e1b4d422168e" FOREIGN KEY ("dataset_id") REFERENCES "weather_dataset"("id") ON DELETE SET NULL ON UPDATE NO ACTION`);
    await queryRunner.query(`ALTER TABLE "weather_import_chunk" ADD CONSTRAINT "FK_236dd6657cce22b43b23e596412" FOREIGN KEY ("import_id") REFERENCES "weather_import"("id") ON DELETE CASCADE ON UPDATE NO ACTION`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "weather_import_chunk" DROP CONSTRAINT "FK_236dd6657cce22b43b23e596412"`);
    await queryRunner.query(`ALTER TABLE "weather_import" DROP CONSTRAINT "FK_2085983e8ab6860e1b4d422168e"`);
    await queryRunner.query(`ALTER TABLE "weather_import" DROP CONSTRAINT "FK_9bf90e9a58e2e0557a3b97f4a8d"`);
    await queryRunner.query(`ALTER TABLE "weather_import" DROP CONSTRAINT "FK_1fb4e1b5bff2c217132a1af89b6"`);
    await queryRunner.query(`ALTER TABLE "weather_record" DROP CONSTRAINT "FK_64e11241cb5066c2e494eb9eabd"`);
    await queryRunner.query(`ALTER TABLE "weather_dataset" DROP CONSTRAINT "FK_0605da45f729fd597aba83725e6"`);
    await queryRunner.query(`ALTER TABLE "weather_dataset" DROP CONSTRAINT "FK_54129661536f8d490df0452a15f"`);
    await queryRunner.query(`ALTER TABLE "weather_dataset" DROP CONSTRAINT "FK_e998ea2086e1b155efac0e23dd1"`);
    await queryRunner.query(`DROP TABLE "weather_import_chunk"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_1fb4e1b5bff2c217132a1af89b"`);
    await queryRunner.query(`DROP TABLE "weather_import"`);
    await queryRunner.query(`DROP TYPE "public"."weather_row_error_policy"`);
    await queryRunner.query(`DROP TYPE "public"."weather_import_state"`);
    await queryRunner.query(`DROP TABLE "weather_record"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_54129661536f8d490df0452a15"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_e998ea2086e1b155efac0e23dd"`);
    await queryRunner.query(`DROP TABLE "weather_dataset"`);
    await queryRunner.query(`DROP TYPE "public"."visibility_unit"`);
    await queryRunner.query(`DROP TYPE "public"."visibility_definition"`);
  }
}

import { MigrationInterface, QueryRunner } from "typeorm";

/** Counters of @nestjs/throttler shared by every API process (sign-in limits). */
export class CreateRateLimitCounters1796200000000 implements MigrationInterface {
    name = 'CreateRateLimitCounters1796200000000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`CREATE TABLE "rate_limit_counter" ("key" character varying(128) NOT NULL, "throttler" character varying(64) NOT NULL, "hits" integer NOT NULL, "window_ends_at" TIMESTAMP WITH TIME ZONE NOT NULL, "blocked_until" TIMESTAMP WITH TIME ZONE, CONSTRAINT "PK_5bfa3ad3fe33321b1d17eae4746" PRIMARY KEY ("key"))`);
        await queryRunner.query(`CREATE INDEX "IDX_rate_limit_counter_expiry" ON "rate_limit_counter"  ("window_ends_at") `);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`DROP INDEX "public"."IDX_rate_limit_counter_expiry"`);
        await queryRunner.query(`DROP TABLE "rate_limit_counter"`);
    }

}

import { MigrationInterface, QueryRunner } from "typeorm";

/** Sessions behind the access tokens (checked on every request) and a member's deactivation time. */
export class CreateUserSessionsAndDeactivation1796200100000 implements MigrationInterface {
    name = 'CreateUserSessionsAndDeactivation1796200100000'

    public async up(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "app_user" ADD "deactivated_at" TIMESTAMP WITH TIME ZONE`);
        await queryRunner.query(`CREATE TABLE "user_session" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "user_id" uuid NOT NULL, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "expires_at" TIMESTAMP WITH TIME ZONE NOT NULL, "revoked_at" TIMESTAMP WITH TIME ZONE, CONSTRAINT "PK_adf3b49590842ac3cf54cac451a" PRIMARY KEY ("id"))`);
        await queryRunner.query(`CREATE INDEX "IDX_13275383dcdf095ee29f2b3455" ON "user_session"  ("user_id") `);
        await queryRunner.query(`ALTER TABLE "user_session" ADD CONSTRAINT "FK_13275383dcdf095ee29f2b3455a" FOREIGN KEY ("user_id") REFERENCES "app_user"("id") ON DELETE CASCADE ON UPDATE NO ACTION`);
    }

    public async down(queryRunner: QueryRunner): Promise<void> {
        await queryRunner.query(`ALTER TABLE "user_session" DROP CONSTRAINT "FK_13275383dcdf095ee29f2b3455a"`);
        await queryRunner.query(`DROP INDEX "public"."IDX_13275383dcdf095ee29f2b3455"`);
        await queryRunner.query(`DROP TABLE "user_session"`);
        await queryRunner.query(`ALTER TABLE "app_user" DROP COLUMN "deactivated_at"`);
    }

}

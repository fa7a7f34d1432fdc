/**
 * Test-only organisations with one user per role. The demo seed has a single organisation; the
 * isolation tests need a second one, and every test makes its own so tests never share rows.
 */
import type { INestApplication } from '@nestjs/common';
import { randomBytes } from 'node:crypto';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { ROLES, type Role } from '@beamwright/link-core/contracts';
import { Organisation } from '../../src/organisations/organisation.entity.js';
import { upsertOrganisation, upsertUser } from '../../src/database/seeds/demo-seed.js';

export const TEST_PASSWORD = 'test-password-2026';

export interface TestMember {
  id: string;
  email: string;
  role: Role;
  token: string;
}

export interface TestOrganisation {
  id: string;
  name: string;
  members: Record<Role, TestMember>;
  /** deletes the organisation with its users and data */
  remove(): Promise<void>;
}

export async function createTestOrganisation(app: INestApplication, label: string): Promise<TestOrganisation> {
  const dataSource = app.get(DataSource);
  const suffix = randomBytes(5).toString('hex');
  const organisation = await dataSource.transaction((manager) =>
    upsertOrganisation(manager, { slug: `test-${label}-${suffix}`, name: `Test organisation ${label} ${suffix}` }),
  );
  const members = {} as Record<Role, TestMember>;
  for (const role of ROLES) {
    const email = `${role}.${suffix}@${label}.test`;
    await dataSource.transaction((manager) =>
      upsertUser(manager, organisation.id, { email, displayName: `${role} ${label}`, role, password: TEST_PASSWORD }),
    );
    const login = await request(app.getHttpServer()).post('/api/auth/login').send({ email, password: TEST_PASSWORD }).expect(200);
    const me = await request(app.getHttpServer()).get('/api/auth/me').set('Authorization', `Bearer ${login.body.accessToken}`).expect(200);
    members[role] = { id: me.body.user.id, email, role, token: login.body.accessToken };
  }
  return {
    id: organisation.id,
    name: organisation.name,
    members,
    async remove() {
      // links first (their revisions and reviews go with them), so the users they reference can go
      await dataSource.query('DELETE FROM link WHERE organisation_id = $1', [organisation.id]);
      await dataSource.getRepository(Organisation).delete(organisation.id);
    },
  };
}

/** `Authorization` header of a member. */
export function bearer(member: TestMember): [string, string] {
  return ['Authorization', `Bearer ${member.token}`];
}

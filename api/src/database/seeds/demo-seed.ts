import type { DataSource, EntityManager } from 'typeorm';
import type { Role } from '@beamwright/link-core/contracts';
import { Organisation } from '../../organisations/organisation.entity.js';
import { User } from '../../users/user.entity.js';
import { hashPassword, verifyPassword } from '../../users/password-hasher.js';
import { readDemoFixtures, type DemoFixtures } from './demo-fixtures.js';

export interface SeedSummary {
  organisationId: string;
  usersCreated: number;
  usersUpdated: number;
}

/**
 * Seeds the fictional demo organisation and its people. Idempotent: it finds its organisation by
 * slug and users by e-mail, creates what is missing, and brings names, roles and the password
 * (from DEMO_PASSWORD) back to the fixture's values; it never deletes anything.
 */
export async function seedDemo(
  dataSource: DataSource,
  { demoPassword, fixtures = readDemoFixtures() }: { demoPassword: string; fixtures?: DemoFixtures },
): Promise<SeedSummary> {
  return dataSource.transaction(async (manager) => {
    const organisation = await upsertOrganisation(manager, fixtures.organisation);
    let usersCreated = 0;
    let usersUpdated = 0;
    for (const person of fixtures.users) {
      const outcome = await upsertUser(manager, organisation.id, { ...person, password: demoPassword });
      if (outcome === 'created') usersCreated += 1;
      if (outcome === 'updated') usersUpdated += 1;
    }
    return { organisationId: organisation.id, usersCreated, usersUpdated };
  });
}

export async function upsertOrganisation(manager: EntityManager, fixture: { slug: string; name: string }): Promise<Organisation> {
  const repository = manager.getRepository(Organisation);
  const existing = await repository.findOne({ where: { slug: fixture.slug } });
  if (existing) {
    if (existing.name !== fixture.name) await repository.update(existing.id, { name: fixture.name });
    return { ...existing, name: fixture.name };
  }
  return repository.save(repository.create(fixture));
}

export async function upsertUser(
  manager: EntityManager,
  organisationId: string,
  person: { email: string; displayName: string; role: Role; password: string },
): Promise<'created' | 'updated' | 'unchanged'> {
  const repository = manager.getRepository(User);
  const email = person.email.toLowerCase();
  const existing = await repository.findOne({ where: { email } });
  if (!existing) {
    await repository.save(
      repository.create({ organisationId, email, displayName: person.displayName, role: person.role, passwordHash: await hashPassword(person.password) }),
    );
    return 'created';
  }
  const changes: Partial<User> = {};
  if (existing.organisationId !== organisationId) changes.organisationId = organisationId;
  if (existing.displayName !== person.displayName) changes.displayName = person.displayName;
  if (existing.role !== person.role) changes.role = person.role;
  if (!(await verifyPassword(existing.passwordHash, person.password))) changes.passwordHash = await hashPassword(person.password);
  if (Object.keys(changes).length === 0) return 'unchanged';
  await repository.update(existing.id, changes);
  return 'updated';
}

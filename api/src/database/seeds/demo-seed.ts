import type { DataSource, EntityManager } from 'typeorm';
import type { Role } from '@beamwright/link-core/contracts';
import { Organisation } from '../../organisations/organisation.entity.js';
import { User } from '../../users/user.entity.js';
import { hashPassword, verifyPassword } from '../../users/password-hasher.js';
import { EquipmentModel } from '../../equipment/equipment-model.entity.js';
import { Link } from '../../links/link.entity.js';
import { Site } from '../../sites/site.entity.js';
import { readDemoFixtures, type DemoFixtures } from './demo-fixtures.js';
import { seedDemoLink } from './demo-links.js';
import { seedDemoWeather } from './demo-weather.js';

export interface SeedSummary {
  organisationId: string;
  usersCreated: number;
  usersUpdated: number;
  sitesCreated: number;
  equipmentCreated: number;
  linksCreated: number;
  weatherDatasetsCreated: number;
}

/**
 * Seeds the fictional demo organisation: people, sites, the equipment catalogue and links with
 * their revision and review history. Idempotent: it finds its organisation by slug, users by
 * e-mail, sites, models, links and weather data sets by name; creates what is missing; brings names, roles and the
 * password (from DEMO_PASSWORD) back to the fixture's values; never deletes or rewrites a link.
 */
export async function seedDemo(
  dataSource: DataSource,
  { demoPassword, fixtures = readDemoFixtures(), now = new Date() }: { demoPassword: string; fixtures?: DemoFixtures; now?: Date },
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
    const userIds = new Map<string, string>();
    const userRoles = new Map<string, Role>();
    for (const user of await manager.getRepository(User).find({ where: { organisationId: organisation.id } })) {
      userIds.set(user.email, user.id);
      userRoles.set(user.email, user.role);
    }

    let sitesCreated = 0;
    const siteIds = new Map<string, string>();
    for (const { key, ...site } of fixtures.sites) {
      const repository = manager.getRepository(Site);
      let row = await repository.findOne({ where: { organisationId: organisation.id, name: site.name } });
      if (!row) {
        row = await repository.save(repository.create({ ...site, organisationId: organisation.id }));
        sitesCreated += 1;
      }
      siteIds.set(key, row.id);
    }

    let equipmentCreated = 0;
    for (const model of fixtures.equipment) {
      const repository = manager.getRepository(EquipmentModel);
      const exists = await repository.exists({ where: { organisationId: organisation.id, kind: model.kind, name: model.name } });
      if (!exists) {
        await repository.save(repository.create({ ...model, organisationId: organisation.id, illustrative: true }));
        equipmentCreated += 1;
      }
    }

    let linksCreated = 0;
    for (const link of fixtures.links) {
      const exists = await manager.getRepository(Link).exists({ where: { organisationId: organisation.id, name: link.name } });
      if (exists) continue;
      await seedDemoLink(manager, { organisationId: organisation.id, userIds, userRoles, siteIds, now }, link);
      linksCreated += 1;
    }
    const weatherDatasetsCreated = await seedDemoWeather(
      manager,
      { organisationId: organisation.id, siteIds, createdById: userIds.get(fixtures.users.find((user) => user.role === 'engineer')?.email.toLowerCase() ?? '') ?? null },
      fixtures.weather,
    );
    return { organisationId: organisation.id, usersCreated, usersUpdated, sitesCreated, equipmentCreated, linksCreated, weatherDatasetsCreated };
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

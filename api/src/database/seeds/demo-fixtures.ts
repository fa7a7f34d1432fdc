/**
 * Reads the fictional demo scenario from fixtures/demo/*.json and checks its shape, so a typo in a
 * fixture fails the seed with the file and field instead of seeding half a scenario.
 */
import { readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { z } from 'zod';
import { formatZodIssues } from '@beamwright/link-core';
import { RoleSchema } from '@beamwright/link-core/contracts';
import { CHECKOUT_ROOT } from '../../config/checkout-paths.js';

export const DEMO_FIXTURES_DIR = resolve(CHECKOUT_ROOT, 'fixtures', 'demo');

const OrganisationFixtureSchema = z.object({ slug: z.string().min(1), name: z.string().min(1) });
const UsersFixtureSchema = z.object({
  users: z.array(z.object({ email: z.email(), displayName: z.string().min(1), role: RoleSchema })).min(1),
});

export function readFixture<Schema extends z.ZodType>(directory: string, fileName: string, schema: Schema): z.output<Schema> {
  const path = join(directory, fileName);
  const result = schema.safeParse(JSON.parse(readFileSync(path, 'utf8')));
  if (!result.success) {
    const lines = formatZodIssues(result.error).map((issue) => `  ${issue.path}: ${issue.message}`);
    throw new Error(`Invalid demo fixture ${path}:\n${lines.join('\n')}`);
  }
  return result.data;
}

export function readDemoFixtures(directory = DEMO_FIXTURES_DIR) {
  return {
    organisation: readFixture(directory, 'organisation.json', OrganisationFixtureSchema),
    users: readFixture(directory, 'users.json', UsersFixtureSchema).users,
  };
}
export type DemoFixtures = ReturnType<typeof readDemoFixtures>;

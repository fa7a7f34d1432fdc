/**
 * Reads the fictional demo scenario from fixtures/demo/*.json and checks its shape, so a typo in a
 * fixture fails the seed with the file and field instead of seeding half a scenario.
 */
import { readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { z } from 'zod';
import { formatZodIssues } from '@beamwright/link-core';
import { CreateEquipmentRequestSchema, CreateSiteRequestSchema, REVIEW_ACTIONS, RoleSchema } from '@beamwright/link-core/contracts';
import { CHECKOUT_ROOT } from '../../config/checkout-paths.js';

export const DEMO_FIXTURES_DIR = resolve(CHECKOUT_ROOT, 'fixtures', 'demo');

const OrganisationFixtureSchema = z.object({ slug: z.string().min(1), name: z.string().min(1) });
const UsersFixtureSchema = z.object({
  users: z.array(z.object({ email: z.email(), displayName: z.string().min(1), role: RoleSchema })).min(1),
});
const SitesFixtureSchema = z.object({
  sites: z.array(CreateSiteRequestSchema.extend({ key: z.string().min(1) })),
});
const EquipmentFixtureSchema = z.object({ models: z.array(CreateEquipmentRequestSchema) });

const daysAgo = z.number().min(0).max(3650);
/** A design object; checked by LinkDesignSchema when the history is replayed (after merging changes). */
const designObject = z.record(z.string(), z.unknown());
/** A named alternative of the revision's design: in full, or as changes merged into the revision's design. */
const VariantFixtureSchema = z.object({ name: z.string().min(1), design: designObject.optional(), changes: designObject.optional() });
const HistoryEventSchema = z.discriminatedUnion('type', [
  z.object({
    type: z.literal('revision'),
    daysAgo,
    author: z.email(),
    note: z.string(),
    design: designObject.optional(),
    changes: designObject.optional(),
    variants: z.array(VariantFixtureSchema).optional(),
  }),
  z.object({ type: z.literal('review'), daysAgo, action: z.enum(REVIEW_ACTIONS), actor: z.email(), comment: z.string() }),
]);
export type HistoryEvent = z.infer<typeof HistoryEventSchema>;

const LinksFixtureSchema = z.object({
  links: z.array(
    z.object({
      name: z.string().min(1),
      siteA: z.string().nullable(),
      siteB: z.string().nullable(),
      owner: z.email(),
      history: z.array(HistoryEventSchema).min(1),
    }),
  ),
});
export type LinkFixture = z.infer<typeof LinksFixtureSchema>['links'][number];

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
    sites: readFixture(directory, 'sites.json', SitesFixtureSchema).sites,
    equipment: readFixture(directory, 'equipment.json', EquipmentFixtureSchema).models,
    links: readFixture(directory, 'links.json', LinksFixtureSchema).links,
  };
}
export type DemoFixtures = ReturnType<typeof readDemoFixtures>;

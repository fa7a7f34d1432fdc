import type { z } from 'zod';
import type { EquipmentKind, LinkListQuerySchema } from '@beamwright/link-core/contracts';

// The query keys of every feature, general to specific, so one prefix invalidates a whole family
// (TanStack Query's key-factory pattern). They live together because they nest across features:
// a link's reviews, revisions and diffs sit under its detail key, and invalidating the detail
// refreshes them too. Reads and writes use these factories only, never a key written by hand.

/** A links list request as the list screen sends it: the contract's query, parsed (defaults applied). */
export type LinkListParams = Omit<z.output<typeof LinkListQuerySchema>, 'siteId'>;

export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
};

export const linkKeys = {
  all: ['links'] as const,
  lists: () => [...linkKeys.all, 'list'] as const,
  list: (query: LinkListParams) => [...linkKeys.lists(), query] as const,
  details: () => [...linkKeys.all, 'detail'] as const,
  detail: (linkId: string) => [...linkKeys.details(), linkId] as const,
  revisions: (linkId: string) => [...linkKeys.detail(linkId), 'revisions'] as const,
  diff: (linkId: string, from: number, to: number) => [...linkKeys.detail(linkId), 'diff', { from, to }] as const,
};

/** The review trail of a link sits under the link: a change to the link refreshes its trail. */
export const reviewKeys = {
  forLink: (linkId: string) => [...linkKeys.detail(linkId), 'reviews'] as const,
};

export const siteKeys = {
  all: ['sites'] as const,
  lists: () => [...siteKeys.all, 'list'] as const,
  details: () => [...siteKeys.all, 'detail'] as const,
  detail: (siteId: string) => [...siteKeys.details(), siteId] as const,
};

/**
 * Links read for the sites screens (a site's links, the site plan's links). They sit under the
 * links list key, so a change to any link refreshes them with the links list.
 */
export const siteLinkKeys = {
  forSite: (siteId: string) => [...linkKeys.lists(), 'site', siteId] as const,
  plan: () => [...linkKeys.lists(), 'site-plan'] as const,
};

export const equipmentKeys = {
  all: ['equipment'] as const,
  lists: () => [...equipmentKeys.all, 'list'] as const,
  list: (kind: EquipmentKind) => [...equipmentKeys.lists(), { kind }] as const,
  /** the catalogue screen: both kinds, retired models included */
  catalogue: () => [...equipmentKeys.lists(), 'catalogue'] as const,
  details: () => [...equipmentKeys.all, 'detail'] as const,
  detail: (modelId: string) => [...equipmentKeys.details(), modelId] as const,
};

export const organisationKeys = {
  all: ['organisation'] as const,
  settings: () => [...organisationKeys.all, 'settings'] as const,
};

/** Weather data sets of the organisation, and the import jobs that fill them. */
export const weatherKeys = {
  all: ['weather'] as const,
  datasets: () => [...weatherKeys.all, 'datasets'] as const,
  imports: () => [...weatherKeys.all, 'imports'] as const,
  import: (jobId: string) => [...weatherKeys.imports(), jobId] as const,
};

/**
 * A revision's availability over a data set sits under its link (a new revision refreshes it) and
 * is also refreshed with the data sets (one deleted or replaced).
 */
export const availabilityKeys = {
  forLink: (linkId: string) => [...linkKeys.detail(linkId), 'availability'] as const,
  overDataset: (linkId: string, revision: number, datasetId: string, requiredMarginDb: number, variant: number | null = null) =>
    [...availabilityKeys.forLink(linkId), { revision, datasetId, requiredMarginDb, variant }] as const,
  /** the stored design of one revision, which the availability from a typed table is computed for */
  revisionDesign: (linkId: string, revision: number) => [...availabilityKeys.forLink(linkId), 'revision', revision] as const,
};

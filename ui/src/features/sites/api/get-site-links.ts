import { queryOptions, useQuery } from '@tanstack/react-query';
import type { LinkListResponse, LinkSummary } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { siteLinkKeys } from '@/lib/query-keys';

// The api pages its links list at most 100 a page.
const PAGE_SIZE = 100;
/** The plan draws at most this many links (10 pages); an organisation with more sees a note. */
export const SITE_PLAN_MAX_LINKS = 1000;

async function getAllLinks(params: Record<string, string>, signal?: AbortSignal): Promise<{ items: LinkSummary[]; total: number }> {
  const items: LinkSummary[] = [];
  let total = 0;
  for (let page = 1; items.length < SITE_PLAN_MAX_LINKS; page += 1) {
    const body = await api.get<LinkListResponse>('/links', { signal, params: { ...params, page: String(page), pageSize: String(PAGE_SIZE), sort: 'name', order: 'asc' } });
    items.push(...body.items);
    total = body.total;
    if (items.length >= body.total || body.items.length === 0) break;
  }
  return { items, total };
}

/** The links with the site at either end, archived ones included (they still hold the site). */
export const getSiteLinksQueryOptions = (siteId: string) =>
  queryOptions({ queryKey: siteLinkKeys.forSite(siteId), queryFn: ({ signal }) => getAllLinks({ siteId, archived: 'include' }, signal) });

export const useSiteLinks = (siteId: string | undefined) => useQuery({ ...getSiteLinksQueryOptions(siteId ?? ''), enabled: Boolean(siteId) });

/** Every link that is not archived, for the site plan. */
export const getSitePlanLinksQueryOptions = () =>
  queryOptions({ queryKey: siteLinkKeys.plan(), queryFn: ({ signal }) => getAllLinks({}, signal) });

export const useSitePlanLinks = () => useQuery(getSitePlanLinksQueryOptions());

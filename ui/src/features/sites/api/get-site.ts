import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SiteResponse } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { siteKeys } from '@/lib/query-keys';

export const getSite = (siteId: string, signal?: AbortSignal) => api.get<SiteResponse>(`/sites/${encodeURIComponent(siteId)}`, { signal });

export const getSiteQueryOptions = (siteId: string) =>
  queryOptions({ queryKey: siteKeys.detail(siteId), queryFn: ({ signal }) => getSite(siteId, signal) });

export const useSite = (siteId: string | undefined) => useQuery({ ...getSiteQueryOptions(siteId ?? ''), enabled: Boolean(siteId) });

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SiteListResponse } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { siteKeys } from '@/lib/query-keys';

export const getSites = (signal?: AbortSignal) => api.get<SiteListResponse>('/sites', { signal }).then((body) => body.items);

export const getSitesQueryOptions = () =>
  queryOptions({ queryKey: siteKeys.lists(), queryFn: ({ signal }) => getSites(signal), staleTime: 5 * 60_000 });

export const useSites = () => useQuery(getSitesQueryOptions());

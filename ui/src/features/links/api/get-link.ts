import { queryOptions, useQuery } from '@tanstack/react-query';
import type { LinkDetail } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { linkKeys } from '@/lib/query-keys';

export const getLink = (linkId: string, signal?: AbortSignal) => api.get<LinkDetail>(`/links/${encodeURIComponent(linkId)}`, { signal });

export const getLinkQueryOptions = (linkId: string) =>
  queryOptions({ queryKey: linkKeys.detail(linkId), queryFn: ({ signal }) => getLink(linkId, signal) });

export const useLink = (linkId: string) => useQuery(getLinkQueryOptions(linkId));

import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { LinkDetail } from '@/features/links/api/types';

export const getLink = (linkId: string, signal?: AbortSignal) => api.get<LinkDetail>(`/links/${encodeURIComponent(linkId)}`, { signal });

export const getLinkQueryOptions = (linkId: string) =>
  queryOptions({ queryKey: ['links', 'detail', linkId], queryFn: ({ signal }) => getLink(linkId, signal) });

export const useLink = (linkId: string) => useQuery(getLinkQueryOptions(linkId));

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RevisionListResponse } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { linkKeys } from '@/lib/query-keys';

export const getRevisions = (linkId: string, signal?: AbortSignal) =>
  api.get<RevisionListResponse>(`/links/${encodeURIComponent(linkId)}/revisions`, { signal }).then((body) => body.items);

export const getRevisionsQueryOptions = (linkId: string) =>
  queryOptions({ queryKey: linkKeys.revisions(linkId), queryFn: ({ signal }) => getRevisions(linkId, signal) });

export const useRevisions = (linkId: string) => useQuery(getRevisionsQueryOptions(linkId));

import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Revision, RevisionListResponse } from '@/features/links/api/types';

export const getRevisions = (linkId: string, signal?: AbortSignal) =>
  api.get<RevisionListResponse>(`/links/${encodeURIComponent(linkId)}/revisions`, { signal }).then((body) => body.items);

export const getRevisionsQueryOptions = (linkId: string) =>
  queryOptions({ queryKey: ['links', 'revisions', linkId], queryFn: ({ signal }) => getRevisions(linkId, signal) });

export const useRevisions = (linkId: string) => useQuery(getRevisionsQueryOptions(linkId));

export const getRevision = (linkId: string, revision: number, signal?: AbortSignal) =>
  api.get<Revision>(`/links/${encodeURIComponent(linkId)}/revisions/${revision}`, { signal });

export const getRevisionQueryOptions = (linkId: string, revision: number) =>
  queryOptions({
    queryKey: ['links', 'revision', linkId, revision],
    queryFn: ({ signal }) => getRevision(linkId, revision, signal),
    // a stored revision never changes
    staleTime: Number.POSITIVE_INFINITY,
  });

export const useRevision = (linkId: string, revision: number | null) =>
  useQuery({ ...getRevisionQueryOptions(linkId, revision ?? 0), enabled: revision !== null && revision > 0 });

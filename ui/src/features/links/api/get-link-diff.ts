import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RevisionDiffResponse } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { linkKeys } from '@/lib/query-keys';

export const getLinkDiff = (linkId: string, from: number, to: number, signal?: AbortSignal) =>
  api.get<RevisionDiffResponse>(`/links/${encodeURIComponent(linkId)}/diff`, { signal, params: { from, to } });

export const getLinkDiffQueryOptions = (linkId: string, from: number, to: number) =>
  queryOptions({
    queryKey: linkKeys.diff(linkId, from, to),
    queryFn: ({ signal }) => getLinkDiff(linkId, from, to, signal),
    staleTime: Number.POSITIVE_INFINITY,
  });

export const useLinkDiff = (linkId: string, from: number | null, to: number | null) =>
  useQuery({ ...getLinkDiffQueryOptions(linkId, from ?? 0, to ?? 0), enabled: from !== null && to !== null && from !== to });

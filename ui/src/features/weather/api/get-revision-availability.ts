import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { RevisionAvailability } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { availabilityKeys } from '@/lib/query-keys';

/** `variant`: the 0-based position of one of the revision's variants, or null for its own design. */
export const getRevisionAvailability = (linkId: string, revision: number, datasetId: string, requiredMarginDb: number, variant: number | null, signal?: AbortSignal) =>
  api.get<RevisionAvailability>(`/links/${encodeURIComponent(linkId)}/revisions/${revision}/availability`, {
    signal,
    params: variant === null ? { datasetId, requiredMarginDb } : { datasetId, requiredMarginDb, variant },
  });

export const getRevisionAvailabilityQueryOptions = (linkId: string, revision: number, datasetId: string, requiredMarginDb: number, variant: number | null = null) =>
  queryOptions({
    queryKey: availabilityKeys.overDataset(linkId, revision, datasetId, requiredMarginDb, variant),
    queryFn: ({ signal }) => getRevisionAvailability(linkId, revision, datasetId, requiredMarginDb, variant, signal),
    // the figures of the previous choice stay on screen while the next ones come
    placeholderData: keepPreviousData,
    // a data set's records never change: the answer stays good until the data set or link changes
    staleTime: Infinity,
  });

export function useRevisionAvailability(linkId: string, revision: number | null, datasetId: string | null, requiredMarginDb: number, variant: number | null = null) {
  return useQuery({
    ...getRevisionAvailabilityQueryOptions(linkId, revision ?? 0, datasetId ?? '', requiredMarginDb, variant),
    enabled: revision !== null && datasetId !== null,
  });
}

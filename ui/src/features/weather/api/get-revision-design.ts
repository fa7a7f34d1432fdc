import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Revision } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { availabilityKeys } from '@/lib/query-keys';

/** A revision's design and its variants' (name, position, design): the designs an availability can be computed for. */
export const getRevisionDesign = (linkId: string, revision: number, signal?: AbortSignal) =>
  api
    .get<Revision>(`/links/${encodeURIComponent(linkId)}/revisions/${revision}`, { signal })
    .then((body) => ({ design: body.design, variants: (body.variants ?? []).map(({ index, name, design }) => ({ index, name, design })) }));

/** Revisions never change once saved. */
export const getRevisionDesignQueryOptions = (linkId: string, revision: number) =>
  queryOptions({ queryKey: availabilityKeys.revisionDesign(linkId, revision), queryFn: ({ signal }) => getRevisionDesign(linkId, revision, signal), staleTime: Infinity });

export const useRevisionDesign = (linkId: string, revision: number | null) => useQuery({ ...getRevisionDesignQueryOptions(linkId, revision ?? 0), enabled: revision !== null });

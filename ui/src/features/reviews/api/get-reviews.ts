import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ReviewListResponse } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { reviewKeys } from '@/lib/query-keys';

export const getReviews = (linkId: string, signal?: AbortSignal) =>
  api.get<ReviewListResponse>(`/links/${encodeURIComponent(linkId)}/reviews`, { signal }).then((body) => body.items);

export const getReviewsQueryOptions = (linkId: string) =>
  queryOptions({ queryKey: reviewKeys.forLink(linkId), queryFn: ({ signal }) => getReviews(linkId, signal) });

export const useReviews = (linkId: string) => useQuery(getReviewsQueryOptions(linkId));

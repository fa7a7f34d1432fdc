import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { LinkListResponse } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { linkKeys, type LinkListParams } from '@/lib/query-keys';

export type LinkSortField = LinkListParams['sort'];

export const getLinks = (query: LinkListParams, signal?: AbortSignal) =>
  api.get<LinkListResponse>('/links', {
    signal,
    params: {
      page: query.page,
      pageSize: query.pageSize,
      sort: query.sort,
      order: query.order,
      status: query.status,
      q: query.q,
      archived: query.archived,
    },
  });

export const getLinksQueryOptions = (query: LinkListParams) =>
  queryOptions({
    queryKey: linkKeys.list(query),
    queryFn: ({ signal }) => getLinks(query, signal),
    placeholderData: keepPreviousData,
  });

export const useLinks = (query: LinkListParams) => useQuery(getLinksQueryOptions(query));

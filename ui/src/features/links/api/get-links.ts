import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { LinkListResponse, LinkStatus } from '@/features/links/api/types';

export type LinkSortField = 'name' | 'status' | 'linkMarginDb' | 'rangeM' | 'wavelengthM' | 'updatedAt';

export interface LinksQuery {
  page: number;
  pageSize: number;
  sort: LinkSortField;
  order: 'asc' | 'desc';
  status?: LinkStatus;
  q?: string;
  /** archived links: hidden unless `include` (with the others) or `only` */
  archived?: 'include' | 'only';
}

export const getLinks = (query: LinksQuery, signal?: AbortSignal) =>
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

export const getLinksQueryOptions = (query: LinksQuery) =>
  queryOptions({
    queryKey: ['links', 'list', query],
    queryFn: ({ signal }) => getLinks(query, signal),
    placeholderData: keepPreviousData,
  });

export const useLinks = (query: LinksQuery) => useQuery(getLinksQueryOptions(query));

import type { QueryClient } from '@tanstack/react-query';
import { useLoaderData, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { LinkSummarySchema } from '@beamwright/link-core/contracts';
import { getLinkQueryOptions } from '@/features/links/api/get-link';

/** A link's id as the contract has it (a UUID). */
const LinkIdSchema = LinkSummarySchema.shape.id;

/** `:linkId` read with the contract's id schema; any other text is an address with nothing at it (404). */
export function parseLinkIdParam(params: LoaderFunctionArgs['params']): string {
  const parsed = LinkIdSchema.safeParse(params.linkId);
  if (!parsed.success) throw new Response(null, { status: 404, statusText: 'Not Found' });
  return parsed.data;
}

/**
 * The loader of a page of one link: checks the id and starts loading the link with the same
 * queryOptions the page's hooks use (not awaited: the page shows its own skeleton and errors).
 */
export const linkPageLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) => {
    const linkId = parseLinkIdParam(params);
    void queryClient.prefetchQuery(getLinkQueryOptions(linkId));
    return { linkId };
  };

/** The page's link id: from its loader, or read from the address when the loader did not run (no session then). */
export function useLinkIdParam(): string {
  const data = useLoaderData<{ linkId: string } | null>();
  const params = useParams();
  return data?.linkId ?? parseLinkIdParam(params);
}

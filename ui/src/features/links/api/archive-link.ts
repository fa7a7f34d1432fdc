import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LinkDetail } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { linkKeys } from '@/lib/query-keys';

/** `POST /links/:id/archive` or `/unarchive`: the link stays readable, the default list hides it. */
export const setLinkArchived = (linkId: string, archived: boolean) =>
  api.post<LinkDetail>(`/links/${encodeURIComponent(linkId)}/${archived ? 'archive' : 'unarchive'}`);

export function useSetLinkArchived() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ linkId, archived }: { linkId: string; archived: boolean }) => setLinkArchived(linkId, archived),
    onSuccess: (link) => {
      queryClient.setQueryData(linkKeys.detail(link.id), link);
      // the list and the trail show it too
      return queryClient.invalidateQueries({ queryKey: linkKeys.all });
    },
  });
}

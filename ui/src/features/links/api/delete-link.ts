import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { linkKeys } from '@/lib/query-keys';

/** `DELETE /links/:id`: only a never-approved draft, by its owner; anything else answers 409. */
export const deleteLink = (linkId: string) => api.delete<void>(`/links/${encodeURIComponent(linkId)}`);

export function useDeleteLink() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (linkId: string) => deleteLink(linkId),
    // the caller leaves the link's page first; removing its detail now would refetch it (404)
    onSuccess: () => queryClient.invalidateQueries({ queryKey: linkKeys.lists() }),
  });
}

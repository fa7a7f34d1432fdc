import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** `DELETE /links/:id`: only a never-approved draft, by its owner; anything else answers 409. */
export const deleteLink = (linkId: string) => api.delete<void>(`/links/${encodeURIComponent(linkId)}`);

export function useDeleteLink(linkId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteLink(linkId),
    onSuccess: () => {
      queryClient.removeQueries({ queryKey: ['links', 'detail', linkId] });
      return queryClient.invalidateQueries({ queryKey: ['links', 'list'] });
    },
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateLinkRequest, LinkDetail } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { linkKeys } from '@/lib/query-keys';

export const createLink = (input: CreateLinkRequest) => api.post<LinkDetail>('/links', input);

export function useCreateLink() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createLink,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: linkKeys.lists() }),
  });
}

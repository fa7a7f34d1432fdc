import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LinkDesignInput } from '@beamwright/link-core';
import { api } from '@/lib/api-client';
import type { LinkDetail } from '@/features/links/api/types';

export interface CreateLinkInput {
  name: string;
  design: LinkDesignInput;
  siteAId?: string | null;
  siteBId?: string | null;
  note?: string;
}

export const createLink = (input: CreateLinkInput) => api.post<LinkDetail>('/links', input);

export function useCreateLink() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createLink,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['links', 'list'] }),
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ReviewAction, ReviewActionResponse } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';

export interface ReviewActionInput {
  revision: number;
  action: ReviewAction;
  comment: string;
}

export const actOnRevision = (linkId: string, { revision, action, comment }: ReviewActionInput) =>
  api.post<ReviewActionResponse>(`/links/${encodeURIComponent(linkId)}/revisions/${revision}/${action}`, { comment });

export function useActOnRevision(linkId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ReviewActionInput) => actOnRevision(linkId, input),
    // the status shows in the list, the detail and the trail
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['links'] }),
  });
}

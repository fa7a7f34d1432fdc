import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ReviewAction, ReviewActionResponse, ReviewCommentRequest } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { linkKeys } from '@/lib/query-keys';

/** One review step on a revision: the action and revision go in the path, the comment in the body. */
export type ReviewActionInput = ReviewCommentRequest & { revision: number; action: ReviewAction };

export const actOnRevision = (linkId: string, { revision, action, comment }: ReviewActionInput) =>
  api.post<ReviewActionResponse>(`/links/${encodeURIComponent(linkId)}/revisions/${revision}/${action}`, { comment });

export function useActOnRevision(linkId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ReviewActionInput) => actOnRevision(linkId, input),
    // the status shows in the list, the detail and the trail (nested under the detail)
    onSuccess: () => queryClient.invalidateQueries({ queryKey: linkKeys.all }),
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LinkDetail, PromoteVariantRequest } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { linkKeys } from '@/lib/query-keys';

export interface PromoteVariantInput {
  revision: number;
  /** 0-based position of the variant in the revision */
  index: number;
  body?: PromoteVariantRequest;
}

export const promoteVariant = (linkId: string, { revision, index, body }: PromoteVariantInput) =>
  api.post<LinkDetail>(`/links/${encodeURIComponent(linkId)}/revisions/${revision}/variants/${index}/promote`, body ?? {});

/** Makes a stored variant the design of the next revision; the list and the link refresh. */
export function usePromoteVariant(linkId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PromoteVariantInput) => promoteVariant(linkId, input),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: linkKeys.all });
    },
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LinkDesignInput } from '@beamwright/link-core';
import { RevisionConflictBodySchema, type CreateRevisionRequest, type LinkDetail } from '@beamwright/link-core/contracts';
import { api, isApiError } from '@/lib/api-client';
import { linkKeys } from '@/lib/query-keys';

/** What a 409 tells us: someone saved after our base; the body carries their revision. */
export interface RevisionConflict {
  latestRevision: number;
  /** null when the body did not carry a readable revision: the caller fetches the link */
  latestDesign: LinkDesignInput | null;
  message: string;
}

/** The 409 answer to a save, read with the contract's schema; null for any other error. */
export function readRevisionConflict(error: unknown): RevisionConflict | null {
  if (!isApiError(error, 409)) return null;
  const body = RevisionConflictBodySchema.safeParse(error.body);
  if (!body.success) return { latestRevision: 0, latestDesign: null, message: error.message };
  return { latestRevision: body.data.latestRevision, latestDesign: body.data.latest.design, message: error.message };
}

export const saveRevision = (linkId: string, input: CreateRevisionRequest) =>
  api.post<LinkDetail>(`/links/${encodeURIComponent(linkId)}/revisions`, input);

export function useSaveRevision(linkId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateRevisionRequest) => saveRevision(linkId, input),
    onSuccess: async () => {
      // the list shows the latest margin and the detail the latest revision
      await queryClient.invalidateQueries({ queryKey: linkKeys.all });
    },
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LinkDesignInput } from '@beamwright/link-core';
import { api, isApiError } from '@/lib/api-client';
import type { LinkDetail, RevisionConflictBody } from '@/features/links/api/types';

export interface SaveRevisionInput {
  baseRevision: number;
  design: LinkDesignInput;
  note: string;
}

/** What a 409 tells us: someone saved after our base; the body carries their revision. */
export interface RevisionConflict {
  latestRevision: number;
  latestDesign: LinkDesignInput | null;
  message: string;
}

export function readRevisionConflict(error: unknown): RevisionConflict | null {
  if (!isApiError(error, 409)) return null;
  const body = (error.body ?? {}) as Partial<RevisionConflictBody>;
  return {
    latestRevision: typeof body.latestRevision === 'number' ? body.latestRevision : (body.latest?.revision ?? 0),
    latestDesign: body.latest?.design ?? null,
    message: error.message,
  };
}

export const saveRevision = (linkId: string, input: SaveRevisionInput) =>
  api.post<LinkDetail>(`/links/${encodeURIComponent(linkId)}/revisions`, input);

export function useSaveRevision(linkId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SaveRevisionInput) => saveRevision(linkId, input),
    onSuccess: async () => {
      // the list shows the latest margin and the detail the latest revision
      await queryClient.invalidateQueries({ queryKey: ['links'] });
    },
  });
}

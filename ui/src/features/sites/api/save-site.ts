import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateSiteRequest, SiteResponse, UpdateSiteRequest } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { linkKeys, siteKeys } from '@/lib/query-keys';

export const createSite = (input: CreateSiteRequest) => api.post<SiteResponse>('/sites', input);
export const updateSite = (siteId: string, changes: UpdateSiteRequest) => api.patch<SiteResponse>(`/sites/${encodeURIComponent(siteId)}`, changes);
export const deleteSite = (siteId: string) => api.delete<void>(`/sites/${encodeURIComponent(siteId)}`);

/** Creates a site (no id) or changes one; the sites and, for a moved site, the links refresh. */
export function useSaveSite(siteId: string | undefined) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateSiteRequest) => (siteId ? updateSite(siteId, input) : createSite(input)),
    onSuccess: async (site) => {
      queryClient.setQueryData(siteKeys.detail(site.id), site);
      // a moved site changes its links' paths (and may flag approved ones)
      await Promise.all([queryClient.invalidateQueries({ queryKey: siteKeys.all }), queryClient.invalidateQueries({ queryKey: linkKeys.all })]);
    },
  });
}

export function useDeleteSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteSite,
    onSuccess: (_, siteId) => {
      queryClient.removeQueries({ queryKey: siteKeys.detail(siteId) });
      return queryClient.invalidateQueries({ queryKey: siteKeys.lists() });
    },
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { OrganisationSettings, UpdateOrganisationSettingsRequest } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { authKeys, organisationKeys } from '@/lib/query-keys';

export const updateOrganisationSettings = (changes: UpdateOrganisationSettingsRequest) => api.patch<OrganisationSettings>('/organisation/settings', changes);

export function useUpdateOrganisationSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateOrganisationSettings,
    onSuccess: (settings) => {
      queryClient.setQueryData(organisationKeys.settings(), settings);
      // the header shows the organisation's name
      return queryClient.invalidateQueries({ queryKey: authKeys.me() });
    },
  });
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OrganisationSettings } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { organisationKeys } from '@/lib/query-keys';

export const getOrganisationSettings = (signal?: AbortSignal) => api.get<OrganisationSettings>('/organisation/settings', { signal });

export const getOrganisationSettingsQueryOptions = () =>
  queryOptions({ queryKey: organisationKeys.settings(), queryFn: ({ signal }) => getOrganisationSettings(signal), staleTime: 5 * 60_000 });

export const useOrganisationSettings = () => useQuery(getOrganisationSettingsQueryOptions());

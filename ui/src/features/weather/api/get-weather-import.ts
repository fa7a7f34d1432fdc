import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import type { WeatherImportJob } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { weatherKeys } from '@/lib/query-keys';

export const isImportEnded = (job: WeatherImportJob | undefined) => job?.state === 'succeeded' || job?.state === 'failed' || job?.state === 'cancelled';

export const getWeatherImport = (jobId: string, signal?: AbortSignal) => api.get<WeatherImportJob>(`/weather-datasets/imports/${encodeURIComponent(jobId)}`, { signal });

/** Polled a few times a second until the import has ended. */
export const getWeatherImportQueryOptions = (jobId: string) =>
  queryOptions({
    queryKey: weatherKeys.import(jobId),
    queryFn: ({ signal }) => getWeatherImport(jobId, signal),
    refetchInterval: (query) => (isImportEnded(query.state.data) ? false : 400),
  });

export function useWeatherImport(jobId: string | null) {
  const queryClient = useQueryClient();
  const query = useQuery({ ...getWeatherImportQueryOptions(jobId ?? ''), enabled: jobId !== null });
  const succeeded = query.data?.state === 'succeeded';
  useEffect(() => {
    if (succeeded) void queryClient.invalidateQueries({ queryKey: weatherKeys.datasets() });
  }, [succeeded, queryClient]);
  return query;
}

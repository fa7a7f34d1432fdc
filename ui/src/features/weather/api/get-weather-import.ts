import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WeatherImportJob } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { weatherKeys } from '@/lib/query-keys';

export const isImportEnded = (job: WeatherImportJob | undefined) => job?.state === 'succeeded' || job?.state === 'failed' || job?.state === 'cancelled';

export const getWeatherImport = (jobId: string, signal?: AbortSignal) => api.get<WeatherImportJob>(`/weather-datasets/imports/${encodeURIComponent(jobId)}`, { signal });

/** Polled a few times a second until the import has ended; a finished import refreshes the data sets. */
export const getWeatherImportQueryOptions = (jobId: string) =>
  queryOptions({
    queryKey: weatherKeys.import(jobId),
    queryFn: async ({ signal, client }) => {
      const job = await getWeatherImport(jobId, signal);
      if (job.state === 'succeeded') void client.invalidateQueries({ queryKey: weatherKeys.datasets() });
      return job;
    },
    refetchInterval: (query) => (isImportEnded(query.state.data) ? false : 400),
  });

export const useWeatherImport = (jobId: string | null) => useQuery({ ...getWeatherImportQueryOptions(jobId ?? ''), enabled: jobId !== null });

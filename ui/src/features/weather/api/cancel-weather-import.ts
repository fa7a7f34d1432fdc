import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { WeatherImportJob } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { weatherKeys } from '@/lib/query-keys';

export const cancelWeatherImport = (jobId: string) => api.post<WeatherImportJob>(`/weather-datasets/imports/${encodeURIComponent(jobId)}/cancel`);

export function useCancelWeatherImport() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelWeatherImport,
    onSuccess: (job) => queryClient.setQueryData(weatherKeys.import(job.jobId), job),
  });
}

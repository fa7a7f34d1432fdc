import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { linkKeys, weatherKeys } from '@/lib/query-keys';

export const deleteWeatherDataset = (datasetId: string) => api.delete<void>(`/weather-datasets/${encodeURIComponent(datasetId)}`);

export function useDeleteWeatherDataset() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteWeatherDataset,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: weatherKeys.all });
      // availabilities over the deleted data set live under their links
      await queryClient.invalidateQueries({ queryKey: linkKeys.details() });
    },
  });
}

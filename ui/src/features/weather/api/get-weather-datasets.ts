import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WeatherDatasetListResponse } from '@beamwright/link-core/contracts';
import { api } from '@/lib/api-client';
import { weatherKeys } from '@/lib/query-keys';

export const getWeatherDatasets = (signal?: AbortSignal) => api.get<WeatherDatasetListResponse>('/weather-datasets', { signal }).then((body) => body.items);

export const getWeatherDatasetsQueryOptions = () => queryOptions({ queryKey: weatherKeys.datasets(), queryFn: ({ signal }) => getWeatherDatasets(signal) });

export const useWeatherDatasets = () => useQuery(getWeatherDatasetsQueryOptions());

import { QueryClient, type DefaultOptions } from '@tanstack/react-query';
import { isApiError } from '@/lib/api-client';

const queryDefaults: DefaultOptions = {
  queries: {
    staleTime: 30_000,
    refetchOnWindowFocus: false,
    // A 4xx answer will not change by asking again; network blips and 5xx may.
    retry: (failureCount, error) => {
      if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
      return failureCount < 2;
    },
  },
  mutations: { retry: false },
};

export function createQueryClient() {
  return new QueryClient({ defaultOptions: queryDefaults });
}

export const queryClient = createQueryClient();

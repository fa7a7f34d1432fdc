import { render } from '@testing-library/react';
import { RouterProvider, createMemoryRouter } from 'react-router-dom';
import { vi } from 'vitest';
import { AppProvider } from '@/app/provider';
import { createRoutes } from '@/app/router';
import { createQueryClient } from '@/lib/query-client';

export interface MockRoute {
  method?: string;
  /** matched against the path after /api, without the query string */
  path: string | RegExp;
  status?: number;
  body?: unknown | ((request: { url: URL; body: unknown; headers: Headers }) => unknown);
  /** response headers besides Content-Type (e.g. Retry-After) */
  headers?: Record<string, string>;
}

export interface RecordedCall {
  method: string;
  url: URL;
  headers: Headers;
  body: unknown;
}

/** Replaces fetch with a router over `routes`; unmatched requests answer 404 and are recorded. */
export function mockApi(routes: MockRoute[]) {
  const calls: RecordedCall[] = [];
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = new URL(String(input), 'http://localhost');
    const method = (init.method ?? 'GET').toUpperCase();
    const headers = new Headers(init.headers);
    const body = typeof init.body === 'string' ? JSON.parse(init.body) : undefined;
    calls.push({ method, url, headers, body });
    const apiPath = url.pathname.replace(/^\/api/, '');
    const route = routes.find(
      (candidate) =>
        (candidate.method ?? 'GET').toUpperCase() === method &&
        (typeof candidate.path === 'string' ? candidate.path === apiPath : candidate.path.test(apiPath)),
    );
    if (!route) {
      return new Response(JSON.stringify({ statusCode: 404, error: 'Not Found', message: `no mock for ${method} ${apiPath}` }), {
        status: 404,
        headers: { 'Content-Type': 'application/json' },
      });
    }
    const payload = typeof route.body === 'function' ? route.body({ url, body, headers }) : route.body;
    return new Response(payload === undefined ? null : JSON.stringify(payload), {
      status: route.status ?? 200,
      headers: { 'Content-Type': 'application/json', ...route.headers },
    });
  });
  vi.stubGlobal('fetch', fetchMock);
  return { calls, fetchMock };
}

/** Renders the real route table at `path`, with a fresh query cache. */
export function renderApp(path: string) {
  const queryClient = createQueryClient();
  queryClient.setDefaultOptions({ queries: { ...queryClient.getDefaultOptions().queries, retry: false } });
  const router = createMemoryRouter(createRoutes(queryClient), { initialEntries: [path] });
  const utils = render(
    <AppProvider queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProvider>,
  );
  return { ...utils, router, queryClient };
}

export const demoEngineer = {
  user: { id: '6f1d2c3b-1111-4a4a-8888-000000000001', email: 'engineer@demo.test', displayName: 'Ines Okafor' },
  organisation: { id: '6f1d2c3b-2222-4a4a-8888-000000000002', name: 'Harbour Lightlink Ltd' },
  role: 'engineer' as const,
};

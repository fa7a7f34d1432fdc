import { afterEach, describe, expect, it, vi } from 'vitest';
import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { demoEngineer, mockApi, renderApp } from '@/testing/test-utils';
import { getSessionToken, setSessionToken } from '@/lib/session-token';

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('route guard', () => {
  it('sends a visitor without a session to sign-in, remembering where they were going', async () => {
    const { calls } = mockApi([]);
    const { router } = renderApp('/links?status=approved');
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(new URLSearchParams(router.state.location.search).get('redirectTo')).toBe('/links?status=approved');
    expect(calls).toHaveLength(0);
  });

  it('treats an expired token as no session', async () => {
    setSessionToken('old-token', -10);
    mockApi([]);
    const { router } = renderApp('/links');
    await screen.findByRole('heading', { name: 'Sign in' });
    expect(router.state.location.pathname).toBe('/sign-in');
  });

  it('lets a signed-in user through and shows name, role and organisation', async () => {
    setSessionToken('token-abc', 3600);
    mockApi([
      { path: '/auth/me', body: { ...demoEngineer, role: 'installer' } },
      { path: '/links', body: { items: [], total: 0, page: 1, pageSize: 20 } },
    ]);
    renderApp('/links');
    expect(await screen.findByRole('heading', { name: 'Links' })).toBeInTheDocument();
    expect(screen.getByTestId('current-role')).toHaveTextContent('Installer');
    expect(screen.getByText('Harbour Lightlink Ltd')).toBeInTheDocument();
    // installers read designs but do not create them
    expect(screen.queryByRole('button', { name: 'New link' })).not.toBeInTheDocument();
  });
});

describe('api client on 401', () => {
  it('drops the session and returns to sign-in when a data call is refused', async () => {
    setSessionToken('revoked-token', 3600);
    mockApi([
      { path: '/auth/me', body: demoEngineer },
      { path: '/links', status: 401, body: { statusCode: 401, error: 'Unauthorized', message: 'Unauthorized' } },
    ]);
    const { router } = renderApp('/links');
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
    expect(getSessionToken()).toBeNull();
    expect(new URLSearchParams(router.state.location.search).get('redirectTo')).toBe('/links');
  });

  it('returns to sign-in when the profile call itself is refused', async () => {
    setSessionToken('revoked-token', 3600);
    mockApi([{ path: '/auth/me', status: 401, body: { statusCode: 401, error: 'Unauthorized', message: 'Unauthorized' } }]);
    renderApp('/links');
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
    expect(getSessionToken()).toBeNull();
  });

  it('signing out ends the session on the server, clears the session and the unsaved drafts, and shows the sign-in page', async () => {
    setSessionToken('token-abc', 3600);
    const { calls } = mockApi([
      { path: '/auth/me', body: demoEngineer },
      { path: '/links', body: { items: [], total: 0, page: 1, pageSize: 20 } },
      { method: 'POST', path: '/auth/logout', status: 204 },
    ]);
    window.sessionStorage.setItem('beamwright.draft.some-link', '{}');
    renderApp('/links');
    await userEvent.click(await screen.findByRole('button', { name: 'Sign out' }));
    await waitFor(() => expect(getSessionToken()).toBeNull());
    // the server is told with the token being ended
    const logout = calls.filter((call) => call.method === 'POST' && call.url.pathname === '/api/auth/logout');
    expect(logout).toHaveLength(1);
    expect(logout[0]?.headers.get('Authorization')).toBe('Bearer token-abc');
    // unsaved drafts of this user do not stay in the tab for the next one
    expect(window.sessionStorage.getItem('beamwright.draft.some-link')).toBeNull();
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
  });

  it.each([
    ['the server fails', { status: 500, body: { statusCode: 500, error: 'Internal Server Error', message: 'An unexpected error occurred' } }],
    ['the session had already ended', { status: 401, body: { statusCode: 401, error: 'Unauthorized', message: 'Your session has ended; sign in again' } }],
  ])('signs out locally all the same when %s', async (_case, answer) => {
    setSessionToken('token-abc', 3600);
    mockApi([
      { path: '/auth/me', body: demoEngineer },
      { path: '/links', body: { items: [], total: 0, page: 1, pageSize: 20 } },
      { method: 'POST', path: '/auth/logout', ...answer },
    ]);
    renderApp('/links');
    await userEvent.click(await screen.findByRole('button', { name: 'Sign out' }));
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
    expect(getSessionToken()).toBeNull();
  });

  it('signs out at once without waiting for the server, and a late 401 does not sign out the next user', async () => {
    setSessionToken('token-abc', 3600);
    const { fetchMock } = mockApi([
      { path: '/auth/me', body: demoEngineer },
      { path: '/links', body: { items: [], total: 0, page: 1, pageSize: 20 } },
    ]);
    const routed = fetchMock.getMockImplementation()!;
    let releaseLogout: (response: Response) => void = () => {};
    fetchMock.mockImplementation((input: RequestInfo | URL, init?: RequestInit) =>
      String(input).endsWith('/auth/logout') ? new Promise<Response>((resolve) => (releaseLogout = resolve)) : routed(input, init),
    );
    renderApp('/links');
    await userEvent.click(await screen.findByRole('button', { name: 'Sign out' }));
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
    expect(getSessionToken()).toBeNull();
    // the next user signs in before the late answer to the sign-out arrives: it must not sign them out
    setSessionToken('next-users-token', 3600);
    releaseLogout(new Response(JSON.stringify({ statusCode: 401, error: 'Unauthorized', message: 'Sign in required' }), { status: 401 }));
    await new Promise((resolve) => setTimeout(resolve, 20));
    expect(getSessionToken()).toBe('next-users-token');
  });
});

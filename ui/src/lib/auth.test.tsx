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

  it('signing out clears the session and the unsaved drafts, and shows the sign-in page', async () => {
    setSessionToken('token-abc', 3600);
    mockApi([
      { path: '/auth/me', body: demoEngineer },
      { path: '/links', body: { items: [], total: 0, page: 1, pageSize: 20 } },
    ]);
    window.sessionStorage.setItem('beamwright.draft.some-link', '{}');
    renderApp('/links');
    await userEvent.click(await screen.findByRole('button', { name: 'Sign out' }));
    await waitFor(() => expect(getSessionToken()).toBeNull());
    // unsaved drafts of this user do not stay in the tab for the next one
    expect(window.sessionStorage.getItem('beamwright.draft.some-link')).toBeNull();
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeInTheDocument();
  });
});

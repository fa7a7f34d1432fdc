import { afterEach, describe, expect, it, vi } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { demoEngineer, mockApi, renderApp } from '@/testing/test-utils';
import { getSessionToken, setSessionToken } from '@/lib/session-token';

afterEach(() => {
  vi.unstubAllGlobals();
});

const emptyLinks = { items: [], total: 0, page: 1, pageSize: 20 };

describe('sign-in page', () => {
  it('names each missing field next to it and sends nothing', async () => {
    const { calls } = mockApi([]);
    renderApp('/sign-in');
    await userEvent.click(await screen.findByRole('button', { name: 'Sign in' }));

    expect(screen.getByText('Enter your email address.')).toBeInTheDocument();
    expect(screen.getByText('Enter your password.')).toBeInTheDocument();
    expect(screen.getByLabelText(/Email address/)).toHaveAttribute('aria-invalid', 'true');
    expect(calls).toHaveLength(0);
  });

  it('rejects an address without a domain before asking the server', async () => {
    const { calls } = mockApi([]);
    renderApp('/sign-in');
    await userEvent.type(await screen.findByLabelText(/Email address/), 'engineer');
    await userEvent.type(screen.getByLabelText(/Password/), 'whatever');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(screen.getByText('Enter an email address such as name@company.com.')).toBeInTheDocument();
    expect(calls).toHaveLength(0);
  });

  it('shows wrong credentials beside the password field and stays signed out', async () => {
    const { calls } = mockApi([
      { method: 'POST', path: '/auth/login', status: 401, body: { statusCode: 401, error: 'Unauthorized', message: 'Invalid credentials' } },
    ]);
    renderApp('/sign-in');
    await userEvent.type(await screen.findByLabelText(/Email address/), 'engineer@demo.test');
    await userEvent.type(screen.getByLabelText(/Password/), 'wrong-pass');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('The email address or password is not correct.')).toBeInTheDocument();
    expect(screen.getByLabelText(/Password/)).toHaveAttribute('aria-invalid', 'true');
    expect(calls[0]?.body).toEqual({ email: 'engineer@demo.test', password: 'wrong-pass' });
    // the login call must not carry a stale token
    expect(calls[0]?.headers.get('Authorization')).toBeNull();
    expect(getSessionToken()).toBeNull();
  });

  it('puts the api field issues of a 400 next to their fields', async () => {
    mockApi([
      {
        method: 'POST',
        path: '/auth/login',
        status: 400,
        body: { statusCode: 400, error: 'Bad Request', message: 'Validation failed', issues: [{ path: 'email', message: 'must be an e-mail address' }] },
      },
    ]);
    renderApp('/sign-in');
    await userEvent.type(await screen.findByLabelText(/Email address/), 'x@y.example');
    await userEvent.type(screen.getByLabelText(/Password/), 'p');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('must be an e-mail address')).toBeInTheDocument();
  });

  it('says when to try again after too many attempts, from Retry-After, next to the form', async () => {
    const { calls } = mockApi([
      {
        method: 'POST',
        path: '/auth/login',
        status: 429,
        headers: { 'Retry-After': '840' },
        body: { statusCode: 429, error: 'Too Many Requests', message: 'Too many sign-in attempts. Try again in 14 minutes.', retryAfterS: 840 },
      },
    ]);
    renderApp('/sign-in');
    await userEvent.type(await screen.findByLabelText(/Email address/), 'engineer@demo.test');
    await userEvent.type(screen.getByLabelText(/Password/), 'one-more-guess');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Too many sign-in attempts. Try again in 14 minutes.');
    expect(within(screen.getByRole('form', { name: 'Sign in' })).getByRole('alert')).toBe(alert);
    // not a wrong password: the fields are not marked
    expect(screen.getByLabelText(/Password/)).not.toHaveAttribute('aria-invalid', 'true');
    expect(calls).toHaveLength(1);
    expect(getSessionToken()).toBeNull();
  });

  it('takes the wait from the Retry-After header even when the body does not carry it', async () => {
    mockApi([
      {
        method: 'POST',
        path: '/auth/login',
        status: 429,
        headers: { 'Retry-After': '45' },
        body: { statusCode: 429, error: 'Too Many Requests', message: 'Too Many Requests' },
      },
    ]);
    renderApp('/sign-in');
    await userEvent.type(await screen.findByLabelText(/Email address/), 'engineer@demo.test');
    await userEvent.type(screen.getByLabelText(/Password/), 'x');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('Too many sign-in attempts. Try again in 45 seconds.');
  });

  it('signs in, stores the token and returns to the page that was asked for', async () => {
    const { calls } = mockApi([
      { method: 'POST', path: '/auth/login', body: { accessToken: 'token-abc', expiresInS: 3600 } },
      { path: '/auth/me', body: demoEngineer },
      { path: '/links', body: emptyLinks },
    ]);
    const { router } = renderApp('/sign-in?redirectTo=%2Flinks%3Fstatus%3Ddraft');
    await userEvent.type(await screen.findByLabelText(/Email address/), 'engineer@demo.test');
    await userEvent.type(screen.getByLabelText(/Password/), 'demo-pass-2026');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Ines Okafor')).toBeInTheDocument();
    expect(screen.getByTestId('current-role')).toHaveTextContent('Link engineer');
    expect(screen.getByText('Harbour Lightlink Ltd')).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/links');
    expect(router.state.location.search).toBe('?status=draft');
    expect(getSessionToken()).toBe('token-abc');
    const meCall = calls.find((call) => call.url.pathname === '/api/auth/me');
    expect(meCall?.headers.get('Authorization')).toBe('Bearer token-abc');
  });

  it('does not follow a redirect to another site', async () => {
    setSessionToken('token-abc', 3600);
    mockApi([
      { path: '/auth/me', body: demoEngineer },
      { path: '/links', body: emptyLinks },
    ]);
    const { router } = renderApp('/sign-in?redirectTo=%2F%2Fevil.example');
    await waitFor(() => expect(router.state.location.pathname).toBe('/links'));
  });
});

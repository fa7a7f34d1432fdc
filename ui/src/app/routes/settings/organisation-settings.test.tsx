import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { FADE_PROBABILITY_MESSAGE } from '@beamwright/link-core';
import { demoEngineer, mockApi, renderApp, type RecordedCall } from '@/testing/test-utils';
import { setSessionToken } from '@/lib/session-token';

const demoAdmin = { ...demoEngineer, user: { ...demoEngineer.user, displayName: 'Admin' }, role: 'admin' as const };
const settings = { id: demoEngineer.organisation.id, name: demoEngineer.organisation.name, requiredMarginDb: 3, fadeProbability: 0.001, visibilityDefinition: 'contrast-2-percent', distanceUnit: 'km' };

beforeEach(() => setSessionToken('token-abc', 3600));
afterEach(() => vi.unstubAllGlobals());

const patches = (calls: RecordedCall[]) => calls.filter((call) => call.method === 'PATCH' && call.url.pathname === '/api/organisation/settings');

describe('organisation settings', () => {
  it('lets the admin change the defaults, with bad figures named beside their fields and nothing sent', async () => {
    const { calls } = mockApi([
      { path: '/auth/me', body: demoAdmin },
      { path: '/organisation/settings', body: settings },
      { method: 'PATCH', path: '/organisation/settings', body: (request: { body: unknown }) => ({ ...settings, ...(request.body as object) }) },
      { path: '/links', body: { items: [], page: 1, pageSize: 20, total: 0 } },
    ]);
    renderApp('/settings');
    expect(await screen.findByRole('link', { name: 'Settings' }, { timeout: 8000 })).toBeInTheDocument();
    const fade = await screen.findByRole('textbox', { name: /Fade probability/ });
    await userEvent.clear(fade);
    await userEvent.type(fade, '0.9');
    await userEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    expect(await screen.findByText(`Fade probability ${FADE_PROBABILITY_MESSAGE}`)).toBeInTheDocument();
    expect(fade).toHaveAttribute('aria-invalid', 'true');
    expect(patches(calls)).toHaveLength(0);

    await userEvent.clear(fade);
    await userEvent.type(fade, '1e-4');
    const margin = screen.getByRole('textbox', { name: /Required link margin/ });
    await userEvent.clear(margin);
    await userEvent.type(margin, '6');
    await userEvent.selectOptions(screen.getByRole('combobox', { name: /Distance unit/ }), 'm');
    await userEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    await waitFor(() => expect(patches(calls)).toHaveLength(1));
    expect(patches(calls)[0]!.body).toEqual({ name: settings.name, requiredMarginDb: 6, fadeProbability: 1e-4, visibilityDefinition: 'contrast-2-percent', distanceUnit: 'm' });
    expect(await screen.findByText(/Settings saved/)).toBeInTheDocument();
  });

  it('is not offered to an engineer, and the address sends them back to the links', async () => {
    mockApi([
      { path: '/auth/me', body: demoEngineer },
      { path: '/organisation/settings', body: settings },
      { path: '/links', body: { items: [], page: 1, pageSize: 20, total: 0 } },
    ]);
    const { router } = renderApp('/settings');
    await waitFor(() => expect(router.state.location.pathname).toBe('/links'), { timeout: 8000 });
    expect(screen.getByRole('link', { name: 'Sites' })).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'Settings' })).not.toBeInTheDocument();
  });
});

import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { demoEngineer, mockApi, renderApp } from '@/testing/test-utils';
import { linkDetailOf } from '@/testing/link-fixtures';
import { setSessionToken } from '@/lib/session-token';

beforeEach(() => setSessionToken('token-abc', 3600));
afterEach(() => vi.unstubAllGlobals());

function summary(overrides: Partial<ReturnType<typeof linkDetailOf>>) {
  const { design: _design, budget: _budget, ...rest } = { ...linkDetailOf(), ...overrides };
  return rest;
}

describe('links table', () => {
  it('shows status, margin with a worded verdict, range and wavelength, and asks the server to filter', async () => {
    const { calls } = mockApi([
      { path: '/auth/me', body: demoEngineer },
      {
        path: '/links',
        body: {
          items: [
            summary({ id: '11111111-1111-4111-8111-111111111111', name: 'Quay to depot', status: 'in_review', linkMarginDb: 7.25, rangeM: 2400 }),
            summary({ id: '22222222-2222-4222-8222-222222222222', name: 'Mill to school', status: 'draft', linkMarginDb: -1.5, rangeM: 850, wavelengthM: 850e-9 }),
          ],
          page: 1,
          pageSize: 20,
          total: 2,
        },
      },
    ]);
    renderApp('/links');
    const table = await screen.findByTestId('links-table');
    const rows = within(table).getAllByRole('row');
    expect(rows[1]).toHaveTextContent(/Quay to depot.*In review.*\+7\.3 dB · Adequate.*2\.400 km.*1550 nm/);
    expect(rows[2]).toHaveTextContent(/Mill to school.*Draft.*−1\.5 dB · Fails.*850 m.*850 nm/);
    expect(screen.getByRole('button', { name: 'New link' })).toBeInTheDocument();

    await userEvent.type(screen.getByRole('searchbox', { name: 'Search links' }), 'quay');
    await waitFor(() => expect(calls.some((call) => call.url.searchParams.get('q') === 'quay')).toBe(true));
    const request = calls.find((call) => call.url.searchParams.get('q') === 'quay')!;
    expect(request.url.searchParams.get('sort')).toBe('updatedAt');
    expect(request.url.searchParams.get('order')).toBe('desc');
  });

  it('makes each name one plain link to the workspace and says every verdict in words beside an icon', async () => {
    mockApi([
      { path: '/auth/me', body: demoEngineer },
      {
        path: '/links',
        body: {
          items: [
            summary({ id: '11111111-1111-4111-8111-111111111111', name: 'Quay to depot', status: 'approved', linkMarginDb: 1.2 }),
            summary({ id: '22222222-2222-4222-8222-222222222222', name: 'Mill to school', status: 'in_review', linkMarginDb: -3 }),
          ],
          page: 1,
          pageSize: 20,
          total: 2,
        },
      },
    ]);
    renderApp('/links');
    const table = await screen.findByTestId('links-table');
    const [, first, second] = within(table).getAllByRole('row');
    // one focus stop per name: a link, not a button wrapped around a link
    const link = within(first!).getByRole('link', { name: 'Quay to depot' });
    expect(link).toHaveAttribute('href', '/links/11111111-1111-4111-8111-111111111111');
    expect(within(first!).queryAllByRole('button')).toHaveLength(0);
    expect(link.closest('[role="gridcell"]')).not.toHaveAttribute('tabindex');
    // verdicts and review states: a word and an icon beside the colour
    for (const [row, verdict, status] of [[first!, 'Thin', 'Approved'], [second!, 'Fails', 'In review']] as const) {
      const margin = row.querySelector('[data-verdict]')!;
      expect(margin).toHaveTextContent(verdict);
      expect(margin.querySelector('svg')).not.toBeNull();
      const state = row.querySelector('[data-status]')!;
      expect(state).toHaveTextContent(status);
      expect(state.querySelector('svg')).not.toBeNull();
    }
  });
});

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

describe('links table: changed since approval and archived links', () => {
  it('labels a moved approved link and an archived one in words, and shows archived links only on request', async () => {
    const moved = summary({ id: '11111111-1111-4111-8111-111111111111', name: 'Quay to depot', status: 'approved', changedSinceApproval: true, pathChangedAt: '2026-12-02T08:00:00.000Z' });
    const shelved = summary({ id: '22222222-2222-4222-8222-222222222222', name: 'Old mill hop', status: 'installed', archived: true, archivedAt: '2026-12-01T08:00:00.000Z' });
    const { calls } = mockApi([
      { path: '/auth/me', body: demoEngineer },
      {
        path: '/links',
        body: ({ url }: { url: URL }) => {
          const items = url.searchParams.get('archived') === 'include' ? [moved, shelved] : [moved];
          return { items, page: 1, pageSize: 20, total: items.length };
        },
      },
    ]);
    renderApp('/links');
    const table = await screen.findByTestId('links-table');
    expect(within(table).getAllByRole('row')[1]).toHaveTextContent(/Quay to depot.*Approved.*Changed since approval/);
    expect(within(table).queryByText('Old mill hop')).not.toBeInTheDocument();
    expect(calls[calls.length - 1]!.url.searchParams.get('archived')).toBeNull();

    await userEvent.click(screen.getByRole('switch', { name: 'Show archived links' }));
    await waitFor(() => expect(within(screen.getByTestId('links-table')).getByText('Old mill hop')).toBeInTheDocument());
    expect(calls[calls.length - 1]!.url.searchParams.get('archived')).toBe('include');
    const archivedRow = within(screen.getByTestId('links-table')).getAllByRole('row')[2]!;
    expect(archivedRow).toHaveTextContent(/Old mill hop.*Installed.*Archived/);
    expect(within(archivedRow).queryByText('Changed since approval')).not.toBeInTheDocument();
  });
});

describe('links table: signed-off links below the required margin with the current engine', () => {
  it('flags such a link with a word, an icon and its figures, and leaves the others unflagged', async () => {
    const thin = summary({
      id: '33333333-3333-4333-8333-333333333333',
      name: 'Harbour crane hop',
      status: 'approved',
      linkMarginDb: 4.5,
      currentEngine: { linkCoreVersion: '0.2.0', linkMarginDb: 2.387, receivedPowerDbm: -33.6, marginChangeDb: -2.113, belowRequiredMargin: true },
    });
    const comfortable = summary({
      id: '44444444-4444-4444-8444-444444444444',
      name: 'Ridge relay',
      status: 'installed',
      currentEngine: { linkCoreVersion: '0.2.0', linkMarginDb: 12.3, receivedPowerDbm: -23.7, marginChangeDb: 0.1, belowRequiredMargin: false },
    });
    // a draft is not signed off: its figures are the engineer's to fix, not a flag of the list
    const draft = summary({
      id: '55555555-5555-4555-8555-555555555555',
      name: 'Draft over the bay',
      status: 'draft',
      currentEngine: { linkCoreVersion: '0.2.0', linkMarginDb: 1.2, receivedPowerDbm: -34.8, marginChangeDb: -3, belowRequiredMargin: true },
    });
    mockApi([
      { path: '/auth/me', body: demoEngineer },
      { path: '/links', body: { items: [thin, comfortable, draft], page: 1, pageSize: 20, total: 3 } },
    ]);
    renderApp('/links');
    const table = await screen.findByTestId('links-table');
    const rows = within(table).getAllByRole('row');
    const flag = within(rows[1]!).getByTestId('engine-margin-flag');
    expect(flag).toHaveTextContent('Below margin with engine 0.2.0');
    expect(flag.querySelector('svg')).not.toBeNull(); // the icon beside the word
    expect(within(rows[1]!).getByTestId('engine-margin-figures')).toHaveTextContent(
      'Stored 4.50 dB; engine 0.2.0 gives 2.39 dB (−2.11 dB), under the required 3 dB.',
    );
    expect(within(rows[2]!).queryByTestId('engine-margin-flag')).not.toBeInTheDocument();
    expect(within(rows[3]!).queryByTestId('engine-margin-flag')).not.toBeInTheDocument();
  });
});

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

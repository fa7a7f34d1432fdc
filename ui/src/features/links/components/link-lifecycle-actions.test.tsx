import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { demoEngineer, mockApi, renderApp } from '@/testing/test-utils';
import { LINK_ID, linkDetailOf } from '@/testing/link-fixtures';
import { setSessionToken } from '@/lib/session-token';
import type { LinkDetail } from '@beamwright/link-core/contracts';

// ECharts cannot draw in jsdom.
vi.mock('@/components/charts/lazy-echart', () => ({
  LazyEChart: ({ ariaLabel }: { ariaLabel: string }) => <div role="img" aria-label={ariaLabel} />,
}));

beforeEach(() => setSessionToken('token-abc', 3600));
afterEach(() => vi.unstubAllGlobals());

const otherUser = { id: '6f1d2c3b-1111-4a4a-8888-0000000000ff', displayName: 'Someone Else' };

function routes(link: LinkDetail, role = 'engineer', extra: Parameters<typeof mockApi>[0] = []) {
  return [
    { path: '/auth/me', body: { ...demoEngineer, role } },
    { path: `/links/${LINK_ID}`, body: link },
    { path: '/equipment', body: { items: [] } },
    { path: '/links', body: { items: [], page: 1, pageSize: 20, total: 0 } },
    ...extra,
  ];
}

async function findDialog(): Promise<HTMLElement> {
  return waitFor(() => {
    const element = document.querySelector<HTMLElement>('[role="alertdialog"]');
    if (!element) throw new Error('no dialog open');
    return element;
  });
}

describe('delete, archive and restore in the link header', () => {
  it('lets the owner delete a never-approved draft after confirming, then shows the list', async () => {
    const { calls } = mockApi(routes(linkDetailOf(), 'engineer', [{ method: 'DELETE', path: `/links/${LINK_ID}`, status: 204 }]));
    const { router } = renderApp(`/links/${LINK_ID}`);
    await userEvent.click(await screen.findByRole('button', { name: 'Delete link' }, { timeout: 8000 }));
    const dialog = await findDialog();
    expect(dialog).toHaveTextContent('Delete this link?');
    expect(dialog).toHaveTextContent(/all its revisions and its review trail are removed/);
    expect(calls.filter((call) => call.method === 'DELETE')).toHaveLength(0);
    await userEvent.click(within(dialog).getByRole('button', { name: 'Delete link', hidden: true }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/links'));
    expect(calls.filter((call) => call.method === 'DELETE').map((call) => call.url.pathname)).toEqual([`/api/links/${LINK_ID}`]);
  });

  it('offers no delete on a link that was approved once, or to an engineer who does not own it; archive instead', async () => {
    const approved = { ...linkDetailOf(undefined, 2, 'approved'), wasApproved: true };
    const archivedAnswer = { ...approved, archived: true, archivedAt: '2026-12-01T09:00:00.000Z' };
    const { calls } = mockApi(routes(approved, 'engineer', [{ method: 'POST', path: `/links/${LINK_ID}/archive`, body: archivedAnswer }]));
    renderApp(`/links/${LINK_ID}`);
    const archive = await screen.findByRole('button', { name: 'Archive' }, { timeout: 8000 });
    expect(screen.queryByRole('button', { name: 'Delete link' })).not.toBeInTheDocument();
    await userEvent.click(archive);
    const dialog = await findDialog();
    expect(dialog).toHaveTextContent(/stays readable/);
    await userEvent.click(within(dialog).getByRole('button', { name: 'Archive', hidden: true }));
    await waitFor(() => expect(calls.some((call) => call.method === 'POST' && call.url.pathname === `/api/links/${LINK_ID}/archive`)).toBe(true));
  });

  it('hides delete from an engineer who is not the owner', async () => {
    mockApi(routes({ ...linkDetailOf(), owner: otherUser }));
    renderApp(`/links/${LINK_ID}`);
    expect(await screen.findByRole('button', { name: 'Archive' }, { timeout: 8000 })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Delete link' })).not.toBeInTheDocument();
  });

  it('shows an archived link read-only with an Archived label and a Restore button', async () => {
    const archived = { ...linkDetailOf(), archived: true, archivedAt: '2026-12-01T09:00:00.000Z' };
    const restored = { ...archived, archived: false, archivedAt: null };
    const { calls } = mockApi(routes(archived, 'engineer', [{ method: 'POST', path: `/links/${LINK_ID}/unarchive`, body: restored }]));
    renderApp(`/links/${LINK_ID}`);
    expect(await screen.findByTestId('archived-flag', {}, { timeout: 8000 })).toHaveTextContent('Archived');
    expect(screen.getByTestId('revision-meta')).toHaveTextContent(/archived .*read-only until restored/);
    // no design inputs and no save on an archived link, and no review step
    expect(document.querySelector('input[name="rangeM"]')).toBeNull();
    expect(screen.queryByRole('button', { name: 'Submit for review' })).not.toBeInTheDocument();
    await userEvent.click(screen.getByRole('button', { name: 'Restore' }));
    await userEvent.click(within(await findDialog()).getByRole('button', { name: 'Restore', hidden: true }));
    await waitFor(() => expect(calls.some((call) => call.method === 'POST' && call.url.pathname === `/api/links/${LINK_ID}/unarchive`)).toBe(true));
  });

  it('offers the admin, a reviewer and an installer none of these', async () => {
    for (const role of ['admin', 'reviewer', 'installer']) {
      mockApi(routes(linkDetailOf(), role));
      const { unmount } = renderApp(`/links/${LINK_ID}`);
      await screen.findByTestId('revision-meta', {}, { timeout: 8000 });
      expect(screen.queryByRole('button', { name: /Delete link|Archive|Restore/ }), role).not.toBeInTheDocument();
      unmount();
      vi.unstubAllGlobals();
    }
  });

  it('marks a link whose site moved after approval, in words', async () => {
    mockApi(routes({ ...linkDetailOf(undefined, 2, 'approved'), wasApproved: true, changedSinceApproval: true, pathChangedAt: '2026-12-02T08:00:00.000Z' }, 'reviewer'));
    renderApp(`/links/${LINK_ID}`);
    expect(await screen.findByTestId('changed-since-approval', {}, { timeout: 8000 })).toHaveTextContent('Changed since approval');
    expect(screen.getByTestId('path-changed-note')).toHaveTextContent(/moved or changed height .* after its approval: the approval does not cover the path/);
  });
});

import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { demoEngineer, mockApi, renderApp } from '@/testing/test-utils';
import { LINK_ID, linkDetailOf, revisionOf } from '@/testing/link-fixtures';
import { workedExampleDesign } from '@/testing/designs';
import { setSessionToken } from '@/lib/session-token';

beforeEach(() => setSessionToken('token-abc', 3600));
afterEach(() => vi.unstubAllGlobals());

function historyRoutes(role: string, status: 'draft' | 'in_review') {
  const revision1 = revisionOf(workedExampleDesign, 1, 'First layout');
  const revision2 = revisionOf({ ...workedExampleDesign, rangeM: 2400 }, 2, 'Surveyed path');
  const summary = (revision: typeof revision1) => ({
    linkId: revision.linkId,
    revision: revision.revision,
    linkCoreVersion: revision.linkCoreVersion,
    note: revision.note,
    author: revision.author,
    createdAt: revision.createdAt,
    approval: null,
    linkMarginDb: revision.budget.linkMarginDb,
    receivedPowerDbm: revision.budget.receivedPowerDbm,
    rangeM: revision.design.rangeM,
    wavelengthM: revision.design.transmitter.wavelengthM,
  });
  // the revisions are the demo engineer's; any other role signs in as another member
  const user = role === 'engineer' ? demoEngineer.user : { ...demoEngineer.user, id: '6f1d2c3b-1111-4a4a-8888-0000000000aa', email: `${role}@demo.test` };
  return [
    { path: '/auth/me', body: { ...demoEngineer, user, role } },
    { path: `/links/${LINK_ID}`, body: linkDetailOf({ ...workedExampleDesign, rangeM: 2400 }, 2, status) },
    { path: `/links/${LINK_ID}/revisions`, body: { items: [summary(revision1), summary(revision2)] } },
    {
      path: `/links/${LINK_ID}/diff`,
      body: { linkId: LINK_ID, from: 1, to: 2, changes: [{ path: 'rangeM', from: 2000, to: 2400 }] },
    },
    {
      path: `/links/${LINK_ID}/reviews`,
      body: {
        items:
          status === 'in_review'
            ? [
                {
                  id: '5d0c1c8e-0000-4000-8000-000000000001',
                  linkId: LINK_ID,
                  revision: 2,
                  action: 'submit',
                  fromStatus: 'draft',
                  toStatus: 'in_review',
                  comment: 'Ready for sign-off',
                  actor: { id: demoEngineer.user.id, displayName: demoEngineer.user.displayName },
                  createdAt: '2026-11-30T11:00:00.000Z',
                },
              ]
            : [],
      },
    },
  ];
}

describe('history and review', () => {
  it('lists the revisions, the diff of the last two in words and units, and the review trail', async () => {
    mockApi(historyRoutes('reviewer', 'in_review'));
    renderApp(`/links/${LINK_ID}/history`);
    const table = await screen.findByTestId('revisions-table');
    expect(within(table).getByText('Surveyed path')).toBeInTheDocument();
    expect(within(table).getByText('First layout')).toBeInTheDocument();
    expect(await screen.findByTestId('revision-diff')).toHaveTextContent(/Path length\s*2\.000 km\s*2\.400 km/);
    expect(await screen.findByTestId('review-trail')).toHaveTextContent(/submitted revision 2 for review.*Ready for sign-off/);
  });

  it('offers a reviewer approval, and return only with a comment', async () => {
    const { calls } = mockApi([
      ...historyRoutes('reviewer', 'in_review'),
      { method: 'POST', path: `/links/${LINK_ID}/revisions/2/return`, body: { status: 'draft', review: {} } },
    ]);
    renderApp(`/links/${LINK_ID}/history`);
    const actions = await screen.findByTestId('review-actions');
    expect(within(actions).getByRole('button', { name: 'Approve' })).toBeInTheDocument();
    await userEvent.click(within(actions).getByRole('button', { name: 'Return with comment' }));
    const dialog = await waitFor(() => document.querySelector<HTMLElement>('[role="dialog"]') ?? Promise.reject(new Error('no dialog')));
    await userEvent.click(within(dialog).getByRole('button', { name: 'Return with comment', hidden: true }));
    expect(within(dialog).getByText('A comment is required: tell the engineer what to change.')).toBeInTheDocument();
    expect(calls.filter((call) => call.method === 'POST')).toHaveLength(0);

    await userEvent.type(within(dialog).getByRole('textbox', { hidden: true }), 'Use the surveyed mount heights');
    await userEvent.click(within(dialog).getByRole('button', { name: 'Return with comment', hidden: true }));
    await waitFor(() => expect(calls.filter((call) => call.method === 'POST')).toHaveLength(1));
    expect(calls.find((call) => call.method === 'POST')?.body).toEqual({ comment: 'Use the surveyed mount heights' });
  });

  it('offers the engineer submission of a draft and the installer nothing to change', async () => {
    mockApi(historyRoutes('engineer', 'draft'));
    const first = renderApp(`/links/${LINK_ID}/history`);
    const actions = await screen.findByTestId('review-actions');
    expect(within(actions).getByRole('button', { name: 'Submit for review' })).toBeInTheDocument();
    expect(within(actions).queryByRole('button', { name: 'Approve' })).not.toBeInTheDocument();
    first.unmount();

    mockApi(historyRoutes('installer', 'draft'));
    renderApp(`/links/${LINK_ID}/history`);
    await screen.findByTestId('revisions-table');
    expect(screen.queryByTestId('review-actions')).not.toBeInTheDocument();
    expect(document.querySelectorAll('main input, main textarea')).toHaveLength(0);
  });
});

import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { screen } from '@testing-library/react';
import { demoEngineer, mockApi, renderApp } from '@/testing/test-utils';
import { LINK_ID, linkDetailOf } from '@/testing/link-fixtures';
import { setSessionToken } from '@/lib/session-token';
import type { LinkDetail } from '@beamwright/link-core/contracts';

vi.mock('@/components/charts/lazy-echart', () => ({
  LazyEChart: ({ ariaLabel }: { ariaLabel: string }) => <div role="img" aria-label={ariaLabel} />,
}));

beforeEach(() => setSessionToken('token-abc', 3600));
afterEach(() => vi.unstubAllGlobals());

const someoneElse = { id: '6f1d2c3b-1111-4a4a-8888-0000000000ee', displayName: 'Another Author' };

/** The review buttons on the link's history page, where every role sees the trail. */
async function buttonsFor(role: string, link: LinkDetail): Promise<string[]> {
  mockApi([
    { path: '/auth/me', body: { ...demoEngineer, role } },
    { path: `/links/${LINK_ID}`, body: link },
    { path: `/links/${LINK_ID}/revisions`, body: { items: [] } },
    { path: `/links/${LINK_ID}/reviews`, body: { items: [] } },
    { path: '/equipment', body: { items: [] } },
  ]);
  const { unmount } = renderApp(`/links/${LINK_ID}/history`);
  await screen.findByTestId('revision-meta', {}, { timeout: 8000 });
  await screen.findByText(/No review activity yet/, {}, { timeout: 8000 });
  const labels = ['Submit for review', 'Approve', 'Return with comment', 'Record as installed'].filter((name) => screen.queryByRole('button', { name }));
  unmount();
  vi.unstubAllGlobals();
  return labels;
}

describe('review buttons follow the shared rules', () => {
  it('gives each review step to one role only, never to the admin', async () => {
    const inReview = { ...linkDetailOf(undefined, 2, 'in_review'), author: someoneElse };
    const approved = { ...linkDetailOf(undefined, 2, 'approved'), author: someoneElse, wasApproved: true };
    expect(await buttonsFor('admin', inReview)).toEqual([]);
    expect(await buttonsFor('admin', approved)).toEqual([]);
    expect(await buttonsFor('admin', { ...linkDetailOf(), author: someoneElse })).toEqual([]);
    expect(await buttonsFor('reviewer', inReview)).toEqual(['Approve', 'Return with comment']);
    expect(await buttonsFor('installer', approved)).toEqual(['Record as installed']);
    expect(await buttonsFor('installer', inReview)).toEqual([]);
  });

  it('offers a reviewer who wrote the revision only the return, not the approval', async () => {
    // linkDetailOf's author is the signed-in member
    expect(await buttonsFor('reviewer', linkDetailOf(undefined, 2, 'in_review'))).toEqual(['Return with comment']);
  });
});

import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { LinkSummary, SiteResponse } from '@beamwright/link-core/contracts';
import { demoEngineer, mockApi, renderApp, type MockRoute, type RecordedCall } from '@/testing/test-utils';
import { LINK_ID, linkDetailOf } from '@/testing/link-fixtures';
import { setSessionToken } from '@/lib/session-token';
import { sitePlanOf, roundScale } from '@/features/sites/charts/site-plan-chart';

vi.mock('@/components/charts/lazy-echart', () => ({
  LazyEChart: ({ ariaLabel, testId }: { ariaLabel: string; testId?: string }) => <div role="img" aria-label={ariaLabel} data-testid={testId} />,
}));

// Sites of the fictional demo town (fixtures/demo/sites.json).
const depot: SiteResponse = {
  id: '5e1a0c2d-3333-4a4a-8888-000000000001',
  name: 'Tallowmere Depot roof',
  latitudeDeg: 56.0,
  longitudeDeg: 10.0,
  groundElevationM: 12,
  mountHeightM: 9,
  notes: '',
  createdAt: '2026-11-01T10:00:00.000Z',
  updatedAt: '2026-11-01T10:00:00.000Z',
};
const harbour: SiteResponse = { ...depot, id: '5e1a0c2d-3333-4a4a-8888-000000000002', name: 'Harbour Office tower', latitudeDeg: 56.01328, longitudeDeg: 10.01921, groundElevationM: 4, mountHeightM: 38 };

const { design: _design, budget: _budget, linkCoreVersion: _version, note: _note, author: _author, revisedAt: _revisedAt, approval: _approval, wasApproved: _wasApproved, ...summary } = linkDetailOf();
const thinLink: LinkSummary = { ...summary, name: 'Depot to harbour', siteA: { id: depot.id, name: depot.name }, siteB: { id: harbour.id, name: harbour.name }, linkMarginDb: 1.5 };
const linksPage = { items: [thinLink], page: 1, pageSize: 100, total: 1 };

beforeEach(() => setSessionToken('token-abc', 3600));
afterEach(() => vi.unstubAllGlobals());

function routes(extra: MockRoute[] = []): MockRoute[] {
  return [
    ...extra,
    { path: '/auth/me', body: demoEngineer },
    { path: '/sites', body: { items: [depot, harbour] } },
    { path: `/sites/${depot.id}`, body: depot },
    { path: '/links', body: linksPage },
  ];
}
const sitePosts = (calls: RecordedCall[]) => calls.filter((call) => call.method === 'POST' && call.url.pathname === '/api/sites');

describe('site plan geometry', () => {
  it('places the demo sites in east/north metres around their middle point', () => {
    const plan = sitePlanOf([depot, harbour], [thinLink]);
    const [a, b] = plan.sites;
    // 0.01328° of latitude ≈ 1479 m and 0.01921° of longitude at 56° ≈ 1198 m (a metre per
    // 1/111 km of latitude and cos 56° times that of longitude, rough hand figures)
    expect(b!.northM - a!.northM).toBeGreaterThan(1470);
    expect(b!.northM - a!.northM).toBeLessThan(1490);
    expect(b!.eastM - a!.eastM).toBeGreaterThan(1190);
    expect(b!.eastM - a!.eastM).toBeLessThan(1205);
    expect(a!.eastM + b!.eastM).toBeCloseTo(0, 0);
    expect(plan.links).toEqual([expect.objectContaining({ id: LINK_ID, verdict: 'thin' })]);
    expect(roundScale(730)).toBe(500);
    expect(roundScale(1999)).toBe(1000);
    expect(roundScale(2000)).toBe(2000);
  });
});

describe('sites screens (engineer)', () => {
  it('lists the sites and draws the plan with a table that says each verdict in words', async () => {
    mockApi(routes());
    renderApp('/sites');
    const table = await screen.findByRole('table', { name: 'Sites' }, { timeout: 8000 });
    expect(within(table).getByRole('link', { name: depot.name })).toHaveAttribute('href', `/sites/${depot.id}`);
    expect(within(table).getByText('56°00′47.8″ N')).toBeInTheDocument();
    expect(await screen.findByRole('img', { name: /Site plan: 2 sites and 1 links/ })).toBeInTheDocument();
    const planLinks = screen.getByRole('table', { name: 'Links on the plan' });
    expect(within(planLinks).getByRole('link', { name: 'Depot to harbour' })).toHaveAttribute('href', `/links/${LINK_ID}`);
    expect(within(planLinks).getByText(/Thin/)).toHaveAttribute('data-verdict', 'thin');
  });

  it('adds a site typed in DMS, showing what it understood, and sends decimal degrees', async () => {
    const { calls } = mockApi(routes([{ method: 'POST', path: '/sites', status: 201, body: { ...depot, id: '5e1a0c2d-3333-4a4a-8888-000000000009', name: 'Pier lamp' } }]));
    renderApp('/sites/new');
    await userEvent.type(await screen.findByRole('textbox', { name: /Site name/ }, { timeout: 8000 }), 'Pier lamp');
    await userEvent.type(screen.getByRole('textbox', { name: /Latitude/ }), '56 00 47.808 N');
    await userEvent.type(screen.getByRole('textbox', { name: /Longitude/ }), '10 01 09.156 E');
    expect(screen.getByText(/Read as 56\.013280° = 56°00′47\.81″ N/)).toBeInTheDocument();
    await userEvent.type(screen.getByRole('textbox', { name: /Ground elevation/ }), '4');
    await userEvent.type(screen.getByRole('textbox', { name: /Mount height/ }), '7.5');
    await userEvent.click(screen.getByRole('button', { name: 'Add site' }));
    await waitFor(() => expect(sitePosts(calls)).toHaveLength(1));
    const body = sitePosts(calls)[0]!.body as { latitudeDeg: number; longitudeDeg: number; mountHeightM: number };
    expect(body.latitudeDeg).toBeCloseTo(56.01328, 9);
    expect(body.longitudeDeg).toBeCloseTo(10.01921, 6);
    expect(body.mountHeightM).toBe(7.5);
  });

  it('puts a coordinate it cannot read next to its field and sends nothing; an api 400 lands beside its field', async () => {
    const { calls } = mockApi(
      routes([{ method: 'POST', path: '/sites', status: 400, body: { statusCode: 400, error: 'Bad Request', message: 'name is taken', issues: [{ path: 'name', message: 'is already used by another site' }] } }]),
    );
    renderApp('/sites/new');
    const latitude = await screen.findByRole('textbox', { name: /Latitude/ }, { timeout: 8000 });
    await userEvent.type(screen.getByRole('textbox', { name: /Site name/ }), 'Pier lamp');
    await userEvent.type(latitude, '56°61′N');
    await userEvent.type(screen.getByRole('textbox', { name: /Longitude/ }), '10');
    await userEvent.type(screen.getByRole('textbox', { name: /Ground elevation/ }), 'high');
    await userEvent.type(screen.getByRole('textbox', { name: /Mount height/ }), '3');
    await userEvent.click(screen.getByRole('button', { name: 'Add site' }));
    expect(await screen.findByText(/^Latitude is not an angle in decimal degrees or degrees, minutes and seconds/)).toBeInTheDocument();
    expect(latitude).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByRole('textbox', { name: /Ground elevation/ })).toHaveAccessibleDescription(expect.stringContaining('Ground elevation (m) must be a number of metres'));
    expect(sitePosts(calls)).toHaveLength(0);

    await userEvent.clear(latitude);
    await userEvent.type(latitude, '56.0133');
    await userEvent.clear(screen.getByRole('textbox', { name: /Ground elevation/ }));
    await userEvent.type(screen.getByRole('textbox', { name: /Ground elevation/ }), '4');
    await userEvent.click(screen.getByRole('button', { name: 'Add site' }));
    expect(await screen.findByText('Site name is already used by another site')).toBeInTheDocument();
    expect(sitePosts(calls)).toHaveLength(1);
  });

  it('says which links hold a site it may not delete', async () => {
    mockApi(
      routes([
        {
          method: 'DELETE',
          path: `/sites/${depot.id}`,
          status: 409,
          body: { statusCode: 409, error: 'Conflict', message: 'The site cannot be deleted: link uses it (“Depot to harbour”). Move that link to another site first.', links: [{ id: LINK_ID, name: 'Depot to harbour' }] },
        },
      ]),
    );
    renderApp(`/sites/${depot.id}`);
    const links = await screen.findByRole('table', { name: 'Links on this site' }, { timeout: 8000 });
    expect(within(links).getByRole('link', { name: 'Depot to harbour' })).toBeInTheDocument();
    expect(within(links).getByText('Harbour Office tower')).toBeInTheDocument();
    await userEvent.click(screen.getByRole('button', { name: 'Delete site' }));
    const dialog = await waitFor(() => {
      const element = document.querySelector('[role="dialog"]');
      if (!element) throw new Error('no dialog yet');
      return element as HTMLElement;
    });
    await userEvent.click(within(dialog).getByRole('button', { name: 'Delete', hidden: true }));
    const refusal = await screen.findByTestId('site-in-use');
    expect(refusal).toHaveTextContent('The site cannot be deleted: link uses it (“Depot to harbour”)');
    expect(within(refusal).getByRole('link', { name: 'Depot to harbour' })).toHaveAttribute('href', `/links/${LINK_ID}`);
  });
});

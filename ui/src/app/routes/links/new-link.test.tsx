import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { linkGeometry } from '@beamwright/link-core';
import type { SiteResponse } from '@beamwright/link-core/contracts';
import { demoEngineer, mockApi, renderApp, type MockRoute, type RecordedCall } from '@/testing/test-utils';
import { LINK_ID, linkDetailOf } from '@/testing/link-fixtures';
import { setSessionToken } from '@/lib/session-token';

// After creating, the page opens the link workspace, which draws charts; ECharts cannot draw in jsdom.
vi.mock('@/components/charts/lazy-echart', () => ({
  LazyEChart: ({ ariaLabel, testId }: { ariaLabel: string; testId?: string }) => <div role="img" aria-label={ariaLabel} data-testid={testId} />,
}));

// Two sites of the fictional demo town (coordinates and heights as in fixtures/demo/sites.json).
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
const harbour: SiteResponse = {
  ...depot,
  id: '5e1a0c2d-3333-4a4a-8888-000000000002',
  name: 'Harbour Office tower',
  latitudeDeg: 56.01328,
  longitudeDeg: 10.01921,
  groundElevationM: 4,
  mountHeightM: 38,
};

beforeEach(() => setSessionToken('token-abc', 3600));
afterEach(() => vi.unstubAllGlobals());

function routes(createLink: Partial<MockRoute> = {}): MockRoute[] {
  return [
    { path: '/auth/me', body: demoEngineer },
    { path: '/sites', body: { items: [depot, harbour] } },
    { path: `/links/${LINK_ID}`, body: linkDetailOf() },
    { path: '/equipment', body: { items: [] } },
    { method: 'POST', path: '/links', status: 201, body: linkDetailOf(), ...createLink },
  ];
}

const posts = (calls: RecordedCall[]) => calls.filter((call) => call.method === 'POST' && call.url.pathname === '/api/links');
const nameInput = () => screen.getByRole('textbox', { name: /Link name/ });
const pathInput = () => screen.getByRole('textbox', { name: /Path length/ });
const submit = () => userEvent.click(screen.getByRole('button', { name: 'Create and open' }));

async function openNewLinkPage(mockRoutes: MockRoute[]) {
  const api = mockApi(mockRoutes);
  const app = renderApp('/links/new');
  await screen.findByRole('heading', { name: 'New link' }, { timeout: 8000 });
  // wait until the site choices have arrived
  await screen.findAllByRole('option', { name: harbour.name, hidden: true });
  return { ...api, ...app };
}

describe('new link (engineer)', () => {
  it('names the missing name and path length next to their fields and sends nothing', async () => {
    const { calls } = await openNewLinkPage(routes());
    await submit();

    expect(await screen.findByText('Link name is required')).toBeInTheDocument();
    expect(screen.getByText('Path length is required (or choose both sites)')).toBeInTheDocument();
    expect(nameInput()).toHaveAttribute('aria-invalid', 'true');
    expect(pathInput()).toHaveAttribute('aria-invalid', 'true');
    // Fluent ties the validation message to its input
    expect(nameInput()).toHaveAccessibleDescription(expect.stringContaining('Link name is required'));
    expect(pathInput()).toHaveAccessibleDescription(expect.stringContaining('Path length is required (or choose both sites)'));
    expect(posts(calls)).toHaveLength(0);
  });

  it('posts the typed name and a path length with units in metres, then opens the new link', async () => {
    const { calls, router } = await openNewLinkPage(routes());
    await userEvent.type(nameInput(), '  Quay office to pumping station ');
    await userEvent.type(pathInput(), '2.4 km');
    await submit();

    await waitFor(() => expect(posts(calls)).toHaveLength(1));
    const body = posts(calls)[0]!.body as { name: string; design: { rangeM: number }; siteAId: string | null; siteBId: string | null };
    expect(body.name).toBe('Quay office to pumping station');
    expect(body.design.rangeM).toBe(2400);
    expect(body.siteAId).toBeNull();
    expect(body.siteBId).toBeNull();
    await waitFor(() => expect(router.state.location.pathname).toBe(`/links/${LINK_ID}`));
  });

  it('takes the path length from the two chosen sites when none is typed', async () => {
    const { calls, router } = await openNewLinkPage(routes());
    await userEvent.type(nameInput(), 'Depot to harbour');
    await userEvent.selectOptions(screen.getByRole('combobox', { name: /Site A/ }), depot.name);
    await userEvent.selectOptions(screen.getByRole('combobox', { name: /Site B/ }), harbour.name);

    const expected = linkGeometry({
      a: { latDeg: depot.latitudeDeg, lonDeg: depot.longitudeDeg, heightM: depot.groundElevationM + depot.mountHeightM },
      b: { latDeg: harbour.latitudeDeg, lonDeg: harbour.longitudeDeg, heightM: harbour.groundElevationM + harbour.mountHeightM },
    });
    // the slant range the page offers is the ground distance plus a 21 m height difference: within 1 m of each other here
    expect(Math.abs(expected.slantRangeM - expected.distanceM)).toBeLessThan(1);
    expect(await screen.findByText(/^From the two sites: .* slant range\. Type a value to override it\.$/)).toBeInTheDocument();
    await submit();

    await waitFor(() => expect(posts(calls)).toHaveLength(1));
    const body = posts(calls)[0]!.body as { name: string; design: { rangeM: number }; siteAId: string | null; siteBId: string | null };
    expect(body.siteAId).toBe(depot.id);
    expect(body.siteBId).toBe(harbour.id);
    expect(Math.abs(body.design.rangeM - expected.distanceM)).toBeLessThan(1);
    expect(Math.abs(body.design.rangeM - expected.slantRangeM)).toBeLessThan(1e-6);
    await waitFor(() => expect(router.state.location.pathname).toBe(`/links/${LINK_ID}`));
  });

  it('puts a field problem reported by the api next to the name and stays on the page', async () => {
    const { calls, router } = await openNewLinkPage(
      routes({
        status: 400,
        body: { statusCode: 400, error: 'Bad Request', message: 'Validation failed', issues: [{ path: 'name', message: 'is already used by another link' }] },
      }),
    );
    await userEvent.type(nameInput(), 'Quay office to pumping station');
    await userEvent.type(pathInput(), '850 m');
    await submit();

    expect(await screen.findByText('Link name is already used by another link')).toBeInTheDocument();
    expect(nameInput()).toHaveAttribute('aria-invalid', 'true');
    expect(nameInput()).toHaveAccessibleDescription(expect.stringContaining('Link name is already used by another link'));
    expect(posts(calls)).toHaveLength(1);
    expect((posts(calls)[0]!.body as { design: { rangeM: number } }).design.rangeM).toBe(850);
    expect(router.state.location.pathname).toBe('/links/new');
    // what was typed is kept
    expect(nameInput()).toHaveValue('Quay office to pumping station');
  });

  it("starts the design from the organisation's defaults and reads a bare path length in its unit", async () => {
    const settings = { id: demoEngineer.organisation.id, name: demoEngineer.organisation.name, requiredMarginDb: 6, fadeProbability: 1e-4, visibilityDefinition: 'mor-5-percent', distanceUnit: 'm' };
    const { calls } = await openNewLinkPage([{ path: '/organisation/settings', body: settings }, ...routes()]);
    expect(await screen.findByText(/a number alone is read in metres/)).toBeInTheDocument();
    expect(screen.getByTestId('new-link-defaults')).toHaveTextContent('fade probability 0.0001, visibility on the 5 % (MOR) contrast definition, and a required margin of 6 dB');
    await userEvent.type(nameInput(), 'Depot to clinic');
    await userEvent.type(pathInput(), '850');
    await submit();
    await waitFor(() => expect(posts(calls)).toHaveLength(1));
    const design = (posts(calls)[0]!.body as { design: { rangeM: number; scintillation: { probability: number }; atmosphere: { visibilityDefinition: string } } }).design;
    expect(design.rangeM).toBe(850);
    expect(design.scintillation.probability).toBe(1e-4);
    expect(design.atmosphere.visibilityDefinition).toBe('mor-5-percent');
  });
});

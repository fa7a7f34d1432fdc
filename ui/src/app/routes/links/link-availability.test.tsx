import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { RECORDS_AVAILABILITY_METHOD, type RevisionAvailability, type WeatherDataset } from '@beamwright/link-core/contracts';
import { demoEngineer, mockApi, renderApp, type MockRoute } from '@/testing/test-utils';
import { LINK_ID, linkDetailOf, revisionOf } from '@/testing/link-fixtures';
import { workedExampleDesign } from '@/testing/designs';
import { setSessionToken } from '@/lib/session-token';

vi.mock('@/components/charts/lazy-echart', () => ({
  LazyEChart: ({ ariaLabel, testId }: { ariaLabel: string; testId?: string }) => <div role="img" aria-label={ariaLabel} data-testid={testId} />,
}));

const DATASET_ID = '7a1b2c3d-4444-4a4a-8888-000000000001';
const dataset: WeatherDataset = {
  id: DATASET_ID,
  name: 'Quay station hourly',
  notes: '',
  siteId: null,
  siteName: null,
  visibilityDefinition: 'mor-5-percent',
  sourceUnit: 'm',
  sourceFileName: 'quay.csv',
  recordCount: 17520,
  missingVisibilityCount: 0,
  firstObservedAt: '2024-01-01T00:00:00.000Z',
  lastObservedAt: '2025-12-31T23:00:00.000Z',
  measured: { rainRate: false, snowRate: false, temperature: false, cn2: false },
  invented: false,
  createdAt: '2026-11-01T10:00:00.000Z',
  createdBy: null,
};

function availabilityOf(requiredMarginDb: number): RevisionAvailability {
  return {
    linkId: LINK_ID,
    revision: 2,
    datasetId: DATASET_ID,
    requiredMarginDb,
    visibilityDefinition: 'mor-5-percent',
    availability: 0.99512,
    unavailableHours: 85.5,
    coveredHours: 17520,
    annualDowntimeH: 42.8,
    outageCount: 12,
    longestOutageH: 14,
    minimumVisibilityM: 612,
    clearAirMarginDb: 21.4,
    worstMarginDb: -80,
    recordCount: 17520,
    usableCount: 17520,
    missingCount: 0,
    months: [
      { month: 1, availability: 0.99, coveredHours: 1488, unavailableHours: 14.9 },
      { month: 7, availability: 1, coveredHours: 1488, unavailableHours: 0 },
    ],
    longestOutages: [{ startsAt: '2024-01-12T04:00:00.000Z', durationH: 14, lowestVisibilityM: 90 }],
    marginDistribution: { binWidthDb: 2, floorDb: -30, belowHours: 40, bins: [{ lowerDb: 20, upperDb: 22, hours: 17480 }], exceeded: [{ share: 0.99, marginDb: 12.5 }] },
    rangesForAvailability: [
      { targetAvailability: 0.99, status: 'found', rangeM: 2650, visibilityM: 800 },
      { targetAvailability: 0.999, status: 'found', rangeM: 640, visibilityM: 180 },
      { targetAvailability: 0.9999, status: 'not-achievable', rangeM: null, visibilityM: 40 },
    ],
    availabilityAgainstRange: [
      { rangeM: 100, availability: 1 },
      { rangeM: 2000, availability: 0.995 },
    ],
    method: RECORDS_AVAILABILITY_METHOD,
  };
}

beforeEach(() => setSessionToken('token-abc', 3600));
afterEach(() => vi.unstubAllGlobals());

function routes(): MockRoute[] {
  return [
    { path: '/auth/me', body: demoEngineer },
    { path: `/links/${LINK_ID}`, body: linkDetailOf() },
    { path: `/links/${LINK_ID}/revisions`, body: { items: [1, 2].map((revision) => ({ ...revisionOf(workedExampleDesign, revision), design: undefined, budget: undefined })) } },
    { path: `/links/${LINK_ID}/revisions/2`, body: revisionOf(workedExampleDesign, 2) },
    { path: '/weather-datasets', body: { items: [dataset] } },
    { path: `/links/${LINK_ID}/revisions/2/availability`, body: ({ url }: { url: URL }) => availabilityOf(Number(url.searchParams.get('requiredMarginDb'))) },
  ];
}

describe('the availability page of a link', () => {
  it('shows the availability over the data set with its method, months, outages and the ranges for 99 / 99.9 / 99.99 %', async () => {
    const { calls } = mockApi(routes());
    renderApp(`/links/${LINK_ID}/availability`);
    expect(await screen.findByTestId('availability-headline', undefined, { timeout: 8000 })).toHaveTextContent('99.512 %');
    const asked = calls.find((call) => call.url.pathname.endsWith('/availability'))!;
    expect(Object.fromEntries(asked.url.searchParams)).toEqual({ datasetId: DATASET_ID, requiredMarginDb: '0' });

    expect(screen.getByTestId('availability-method')).toHaveTextContent(/dense fog and strong turbulence rarely coincide/);
    expect(screen.getByTestId('availability-method')).toHaveTextContent(/not the visibility on the rooftops/);
    const ranges = within(screen.getByTestId('availability-ranges'));
    expect(ranges.getByRole('row', { name: /99.0 %.*up to 2.650 km/ })).toBeInTheDocument();
    expect(ranges.getByRole('row', { name: /99.99 %.*not reached even at 50 m/ })).toBeInTheDocument();
    // every chart has its accessible name and its values as a table
    for (const name of ['Availability per calendar month, in percent', 'Availability in percent against path length in kilometres', 'Hours per bin of the margin left after the weather']) {
      expect(screen.getByRole('img', { name })).toBeInTheDocument();
    }
    expect(screen.getAllByRole('button', { name: /Show the values as a table/ })).toHaveLength(3);
    expect(screen.getByTestId('availability-outages')).toHaveTextContent('14 h');
  });

  it('names a required margin that is not a number next to its field, and asks again with a valid one', async () => {
    const { calls } = mockApi(routes());
    renderApp(`/links/${LINK_ID}/availability`);
    await screen.findByTestId('availability-headline', undefined, { timeout: 8000 });
    const margin = screen.getByRole('textbox', { name: /Required margin \(dB\)/ });
    await userEvent.clear(margin);
    await userEvent.type(margin, 'x');
    expect(await screen.findByText('Required margin must be a number of dB')).toBeInTheDocument();
    expect(margin).toHaveAttribute('aria-invalid', 'true');
    await userEvent.clear(margin);
    await userEvent.type(margin, '3');
    await waitFor(() => expect(calls.some((call) => call.url.searchParams.get('requiredMarginDb') === '3')).toBe(true));
  });

  it('computes the availability from a pasted table in the browser', async () => {
    mockApi(routes());
    renderApp(`/links/${LINK_ID}/availability`);
    await screen.findByRole('button', { name: 'Fill in a synthetic example' }, { timeout: 8000 });
    await userEvent.click(screen.getByRole('button', { name: 'Compute the availability' }));
    expect(await screen.findByText(/Cumulative table: needs at least two levels/)).toBeInTheDocument();
    await userEvent.click(screen.getByRole('button', { name: 'Fill in a synthetic example' }));
    await userEvent.click(screen.getByRole('button', { name: 'Compute the availability' }));
    expect(await screen.findByTestId('climatology-headline')).toHaveTextContent(/Availability 9\d\.\d{3} %/);
    expect(screen.getByTestId('climatology-ranges')).toHaveTextContent('99.0 %');
  });
});

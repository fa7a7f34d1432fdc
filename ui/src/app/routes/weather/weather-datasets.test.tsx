import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { WeatherImportJob } from '@beamwright/link-core/contracts';
import { demoEngineer, mockApi, renderApp, type MockRoute } from '@/testing/test-utils';
import { setSessionToken } from '@/lib/session-token';

const JOB_ID = '9c1d2e3f-5555-4a4a-8888-000000000001';
const csv = 'valid,vsby,tmpc\n2024-01-01 00:00,6.00,3.1\n2024-01-01 01:00,0.12,2.9\n2024-01-01 02:00,fog,2.5\n2024-01-01 03:00,5.00,2.4\n';

const job = (changes: Partial<WeatherImportJob>): WeatherImportJob => ({
  jobId: JOB_ID,
  state: 'running',
  statusUrl: `/api/weather-datasets/imports/${JOB_ID}`,
  name: 'airport-export',
  fileName: 'airport-export.csv',
  bytesTotal: csv.length,
  bytesRead: 40,
  rowsRead: 2,
  progress: 0.5,
  attempt: 1,
  createdAt: '2026-12-01T10:00:00.000Z',
  updatedAt: '2026-12-01T10:00:01.000Z',
  result: null,
  error: null,
  ...changes,
});

/** A stand-in for XMLHttpRequest (jsdom's would go to the network): reports upload progress, then answers. */
class FakeUpload {
  static answers: { status: number; body: unknown }[] = [];
  static sent: { headers: Record<string, string>; form: FormData }[] = [];
  readonly upload: { onprogress: ((event: { loaded: number; total: number; lengthComputable: boolean }) => void) | null } = { onprogress: null };
  onload: (() => void) | null = null;
  onerror: (() => void) | null = null;
  onabort: (() => void) | null = null;
  status = 0;
  responseText = '';
  private readonly headers: Record<string, string> = {};
  open() {}
  setRequestHeader(name: string, value: string) {
    this.headers[name] = value;
  }
  getResponseHeader() {
    return null;
  }
  abort() {}
  send(form: FormData) {
    FakeUpload.sent.push({ headers: this.headers, form });
    const answer = FakeUpload.answers.shift()!;
    setTimeout(() => {
      this.upload.onprogress?.({ loaded: 50, total: 100, lengthComputable: true });
      setTimeout(() => {
        this.status = answer.status;
        this.responseText = JSON.stringify(answer.body);
        this.onload?.();
      }, 20);
    }, 10);
  }
}

beforeEach(() => {
  setSessionToken('token-abc', 3600);
  FakeUpload.answers = [];
  FakeUpload.sent = [];
  vi.stubGlobal('XMLHttpRequest', FakeUpload);
});
afterEach(() => vi.unstubAllGlobals());

function routes(polls: WeatherImportJob[]): MockRoute[] {
  return [
    { path: '/auth/me', body: demoEngineer },
    { path: '/sites', body: { items: [] } },
    { path: '/weather-datasets', body: { items: [] } },
    { path: `/weather-datasets/imports/${JOB_ID}`, body: () => (polls.length > 1 ? polls.shift() : polls[0]) },
  ];
}

async function chooseFile() {
  renderApp('/weather');
  const input = await screen.findByTestId('weather-file-input', undefined, { timeout: 8000 });
  await userEvent.upload(input, new File([csv], 'airport-export.csv', { type: 'text/csv' }));
  return screen.findByTestId('weather-mapping');
}

describe('uploading a weather file', () => {
  it('previews the rows, guesses the columns, and follows the upload and the import to its end', async () => {
    mockApi(routes([job({ state: 'running' }), job({ state: 'succeeded', progress: 1, result: { id: '1f2e3d4c-6666-4a4a-8888-000000000001', rowsImported: 3, rowErrors: [], rowErrorCount: 0, missingVisibilityCount: 0 } })]));
    const mapping = await chooseFile();
    expect(within(mapping).getByRole('combobox', { name: /Timestamp column/ })).toHaveValue('valid');
    expect(within(mapping).getByRole('combobox', { name: /Visibility column/ })).toHaveValue('vsby');
    expect(within(mapping).getByRole('combobox', { name: /Visibility unit/ })).toHaveValue('mi');
    expect(within(mapping).getByRole('combobox', { name: /Visibility definition/ })).toHaveValue('mor-5-percent');
    expect(within(mapping).getByRole('combobox', { name: /Air temperature column/ })).toHaveValue('tmpc');
    // the preview reads the rows as the import will
    expect(within(mapping).getByText('line 4, vsby: "fog" is not a number')).toBeInTheDocument();

    FakeUpload.answers.push({ status: 202, body: job({ state: 'queued', bytesRead: 0, rowsRead: 0, progress: 0 }) });
    await userEvent.click(screen.getByRole('button', { name: 'Import the data set' }));
    expect(await screen.findByTestId('upload-progress')).toBeInTheDocument();
    expect(await screen.findByTestId('processing-progress')).toBeInTheDocument();
    expect(await screen.findByText(/Imported “airport-export”/, undefined, { timeout: 5000 })).toBeInTheDocument();

    const sent = FakeUpload.sent[0]!;
    expect(sent.headers.Prefer).toBe('respond-async');
    expect(JSON.parse(String(sent.form.get('mapping')))).toEqual({ timestampColumn: 'valid', visibilityColumn: 'vsby', visibilityUnit: 'mi', visibilityDefinition: 'mor-5-percent', temperatureColumn: 'tmpc' });
    expect(sent.form.get('onRowErrors')).toBe('reject');
    expect((sent.form.get('file') as File).name).toBe('airport-export.csv');
  });

  it('shows a field the api refused next to that field', async () => {
    mockApi(routes([]));
    await chooseFile();
    FakeUpload.answers.push({
      status: 400,
      body: { statusCode: 400, error: 'Bad Request', message: 'mapping.visibilityColumn names a column…', issues: [{ path: 'mapping.visibilityColumn', message: 'names the column "vsby", which is not in the file\'s header' }] },
    });
    await userEvent.click(screen.getByRole('button', { name: 'Import the data set' }));
    const message = await screen.findByText('Visibility column names the column "vsby", which is not in the file\'s header');
    expect(screen.getByRole('combobox', { name: /Visibility column/ })).toHaveAccessibleDescription(expect.stringContaining(message.textContent!));
  });

  it('lists the rows the import refused and imports only the valid ones when asked', async () => {
    mockApi(
      routes([
        job({
          state: 'failed',
          error: { statusCode: 422, error: 'Unprocessable Entity', message: '1 problem…', rowErrors: [{ line: 4, column: 'vsby', message: '"fog" is not a number' }], rowErrorCount: 1 },
        }),
      ]),
    );
    await chooseFile();
    FakeUpload.answers.push({ status: 202, body: job({ state: 'queued' }) });
    await userEvent.click(screen.getByRole('button', { name: 'Import the data set' }));
    const errors = await screen.findByTestId('row-errors', undefined, { timeout: 5000 });
    expect(within(errors).getByRole('row', { name: /4 vsby "fog" is not a number/ })).toBeInTheDocument();
    FakeUpload.answers.push({ status: 201, body: { id: '1f2e3d4c-6666-4a4a-8888-000000000002', rowsImported: 3, rowErrors: [{ line: 4, column: 'vsby', message: '"fog" is not a number' }], rowErrorCount: 1, missingVisibilityCount: 0 } });
    await userEvent.click(screen.getByRole('button', { name: 'Import only the valid rows' }));
    expect(await screen.findByText(/1 row left out/)).toBeInTheDocument();
    await waitFor(() => expect(FakeUpload.sent[1]!.form.get('onRowErrors')).toBe('skip'));
  });
});

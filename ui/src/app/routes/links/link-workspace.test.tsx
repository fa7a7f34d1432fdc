import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { demoEngineer, mockApi, renderApp } from '@/testing/test-utils';
import { LINK_ID, linkDetailOf, revisionOf } from '@/testing/link-fixtures';
import { workedExampleDesign } from '@/testing/designs';
import { setSessionToken } from '@/lib/session-token';

// ECharts needs a canvas or a real layout engine; jsdom has neither. The charts are checked in the browser test.
vi.mock('@/components/charts/lazy-echart', () => ({
  LazyEChart: ({ ariaLabel, testId }: { ariaLabel: string; testId?: string }) => <div role="img" aria-label={ariaLabel} data-testid={testId} />,
}));

const emptyList = { items: [] };

beforeEach(() => {
  setSessionToken('token-abc', 3600);
});
afterEach(() => {
  vi.unstubAllGlobals();
});

function baseRoutes(role: string = 'engineer') {
  return [
    { path: '/auth/me', body: { ...demoEngineer, role } },
    { path: `/links/${LINK_ID}`, body: linkDetailOf() },
    { path: '/equipment', body: emptyList },
  ];
}

// Fluent's dialogs fade in; jsdom may still report them as hidden, so find them by role attribute.
async function findDialog(role: 'dialog' | 'alertdialog' = 'dialog'): Promise<HTMLElement> {
  return waitFor(() => {
    const element = document.querySelector<HTMLElement>(`[role="${role}"]`);
    if (!element) throw new Error(`no ${role} open`);
    return element;
  });
}

const rangeInput = () => document.querySelector<HTMLInputElement>('input[name="rangeM"]')!;
const powerInput = () => document.querySelector<HTMLInputElement>('input[name="transmitter.powerDbm"]')!;

describe('link address', () => {
  it('reads the id with the contract schema: an address that names no link shows nothing there and asks nothing about links', async () => {
    const { calls } = mockApi(baseRoutes());
    renderApp('/links/not-a-link-id');
    expect(await screen.findByText('Page not found', {}, { timeout: 8000 })).toBeInTheDocument();
    expect(calls.filter((call) => call.url.pathname.startsWith('/api/links'))).toHaveLength(0);
  });
});

describe('link workspace (engineer)', () => {
  it('recomputes the margin in the browser as the range is typed, before anything is saved', async () => {
    const { calls } = mockApi(baseRoutes());
    renderApp(`/links/${LINK_ID}`);
    const margin = await screen.findByTestId('link-margin', {}, { timeout: 8000 });
    // LB-01 worked example: published margin 12.33 dB at 2 km
    expect(margin.textContent).toMatch(/^\+12\.3\d dB$/);
    expect(rangeInput().value).toBe('2 km');

    fireEvent.change(rangeInput(), { target: { value: '2.5 km' } });
    await waitFor(() => expect(screen.getByTestId('link-margin').textContent).not.toMatch(/^\+12\.3/));
    const after = Number(screen.getByTestId('link-margin').textContent!.replace(/[^\d.+-]/g, ''));
    expect(after).toBeLessThan(12.33);
    expect(screen.getByTestId('edit-status')).toHaveTextContent('1 field changed since revision 2, not saved yet.');
    expect(screen.getByRole('button', { name: 'Save as revision 3' })).toBeEnabled();
    // no request went out for the recomputation
    expect(calls.filter((call) => call.method !== 'GET')).toHaveLength(0);
  });

  it('names a field that cannot be read and keeps the last valid figures on screen', async () => {
    mockApi(baseRoutes());
    renderApp(`/links/${LINK_ID}`);
    await screen.findByTestId('link-margin', {}, { timeout: 8000 });
    fireEvent.change(rangeInput(), { target: { value: '2 furlongs' } });
    const message = await screen.findByText(/^Path length unknown unit "furlongs"/);
    expect(rangeInput()).toHaveAttribute('aria-invalid', 'true');
    // tied to its field: the input is described by the message (Fluent Field's validationMessage)
    const messageId = message.closest('[id]')?.id;
    expect(messageId).toBeTruthy();
    expect(rangeInput().getAttribute('aria-describedby')?.split(' ')).toContain(messageId);
    expect(rangeInput()).toHaveAccessibleDescription(expect.stringContaining('Path length unknown unit "furlongs"'));
    expect(screen.getByTestId('stale-results')).toBeInTheDocument();
    expect(screen.getByTestId('link-margin').textContent).toMatch(/^\+12\.3\d dB$/);
    // disabled but still focusable (aria-disabled), so keyboard focus is never dropped
    expect(screen.getByRole('button', { name: 'Save as revision 3' })).toHaveAttribute('aria-disabled', 'true');

    fireEvent.change(powerInput(), { target: { value: '60 dBm' } });
    expect(await screen.findByText('Transmit power must be at most 50 dBm (100 W)')).toBeInTheDocument();
  });

  it('shows the eye-safety indication with its caution beside the transmit power', async () => {
    mockApi(baseRoutes());
    renderApp(`/links/${LINK_ID}`);
    const line = await screen.findByTestId('eye-safety-line', {}, { timeout: 8000 });
    expect(line).toHaveTextContent(/Indicative Class/);
    expect(line).toHaveTextContent(/not a certification/);
    expect(line).toHaveTextContent(/laser safety officer/);
    expect(screen.getByTestId('eye-safety-caution')).toHaveTextContent(/qualified laser safety officer/);
  });

  it('after a save conflict shows what changed and re-applies the engineer’s edits on the latest revision', async () => {
    const theirs = { ...workedExampleDesign, transmitter: { ...workedExampleDesign.transmitter, powerDbm: 18 } };
    let saves = 0;
    const { calls } = mockApi([
      ...baseRoutes(),
      {
        method: 'POST',
        path: `/links/${LINK_ID}/revisions`,
        status: 409,
        body: () => {
          saves += 1;
          return { statusCode: 409, error: 'Conflict', message: 'Revision 3 was saved first', latestRevision: 3, latest: revisionOf(theirs, 3) };
        },
      },
    ]);
    renderApp(`/links/${LINK_ID}`);
    await screen.findByTestId('link-margin', {}, { timeout: 8000 });
    fireEvent.change(rangeInput(), { target: { value: '2.5 km' } });
    const saveButton = screen.getByRole('button', { name: 'Save as revision 3' });
    await userEvent.click(saveButton);
    const saveDialog = await findDialog();
    expect(within(saveDialog).getByTestId('save-changes')).toHaveTextContent(/Path length\s*2\.000 km\s*2\.500 km/);
    await userEvent.type(within(saveDialog).getByRole('textbox', { hidden: true }), 'Surveyed path');
    await userEvent.click(within(saveDialog).getByRole('button', { name: 'Save revision', hidden: true }));

    const conflict = await findDialog('alertdialog');
    expect(conflict).toHaveTextContent('Revision 3 was saved while you were editing');
    expect(within(conflict).getByTestId('conflict-their-changes')).toHaveTextContent(/Transmit power\s*20\.00 dBm\s*18\.00 dBm/);
    expect(saves).toBe(1);
    const saveCall = calls.find((call) => call.method === 'POST');
    expect(saveCall?.body).toMatchObject({ baseRevision: 2, note: 'Surveyed path', design: { rangeM: 2500 } });

    await userEvent.click(within(conflict).getByRole('button', { name: 'Load revision 3 and re-apply my edits', hidden: true }));
    await waitFor(() => expect(document.querySelector('[role="alertdialog"]')).toBeNull());
    expect(rangeInput().value).toBe('2.5 km');
    expect(powerInput().value).toBe('18 dBm');
    expect(screen.getByTestId('rebase-notice')).toHaveTextContent('Now editing on top of revision 3');
    expect(screen.getByTestId('rebase-notice')).toHaveTextContent('Path length');
    expect(screen.getByTestId('rebase-notice').closest('[role="status"]')).toHaveAttribute('aria-live', 'polite');
    // the closing alert dialog keeps the page inert until its exit animation ends
    expect(await screen.findByRole('button', { name: 'Save as revision 4' })).toBeEnabled();

    // the note typed before the conflict is still there
    await userEvent.click(screen.getByRole('button', { name: 'Save as revision 4' }));
    expect(within(await findDialog()).getByRole('textbox', { hidden: true })).toHaveValue('Surveyed path');
  });

  it('saves a new revision on top of the one it started from', async () => {
    const { calls } = mockApi([
      ...baseRoutes(),
      {
        method: 'POST',
        path: `/links/${LINK_ID}/revisions`,
        status: 201,
        body: ({ body }: { body: unknown }) => ({ ...linkDetailOf((body as { design: typeof workedExampleDesign }).design, 3) }),
      },
    ]);
    renderApp(`/links/${LINK_ID}`);
    await screen.findByTestId('link-margin', {}, { timeout: 8000 });
    fireEvent.change(rangeInput(), { target: { value: '1800 m' } });
    await userEvent.click(screen.getByRole('button', { name: 'Save as revision 3' }));
    const dialog = await findDialog();
    await userEvent.click(within(dialog).getByRole('button', { name: 'Save revision', hidden: true }));
    const noteError = within(dialog).getByText(/Add a note: what changed and why/);
    const note = within(dialog).getByRole('textbox', { hidden: true });
    expect(note).toHaveAttribute('aria-invalid', 'true');
    expect(note.getAttribute('aria-describedby')?.split(' ')).toContain(noteError.closest('[id]')?.id);
    await userEvent.type(within(dialog).getByRole('textbox', { hidden: true }), 'Shorter path');
    await userEvent.click(within(dialog).getByRole('button', { name: 'Save revision', hidden: true }));
    expect(await screen.findByTestId('saved-notice')).toHaveTextContent('Saved as revision 3.');
    // announced: the notice appears inside a polite live region that was there before it
    expect(screen.getByTestId('saved-notice').closest('[role="status"]')).toHaveAttribute('aria-live', 'polite');
    const post = calls.find((call) => call.method === 'POST');
    expect(post?.body).toMatchObject({ baseRevision: 2, note: 'Shorter path', design: { rangeM: 1800 } });
    expect(screen.getByTestId('edit-status')).toHaveTextContent('No unsaved changes to revision 3.');
  });
});

describe('unsaved edits across a reload', () => {
  it('brings back what was typed, and re-applies it when someone saved in between', async () => {
    mockApi(baseRoutes());
    const first = renderApp(`/links/${LINK_ID}`);
    await screen.findByTestId('link-margin', {}, { timeout: 8000 });
    fireEvent.change(rangeInput(), { target: { value: '2.5 km' } });
    await waitFor(() => expect(window.sessionStorage.getItem(`beamwright.draft.${LINK_ID}`)).toContain('2.5 km'));
    first.unmount();

    // same revision on the server: the edit simply comes back
    mockApi(baseRoutes());
    const second = renderApp(`/links/${LINK_ID}`);
    expect(await screen.findByTestId('restored-notice', {}, { timeout: 8000 })).toBeInTheDocument();
    expect(rangeInput().value).toBe('2.5 km');
    expect(screen.getByTestId('edit-status')).toHaveTextContent('1 field changed since revision 2');
    second.unmount();

    // revision 3 appeared meanwhile: the edit is re-applied on top of it
    const theirs = { ...workedExampleDesign, transmitter: { ...workedExampleDesign.transmitter, powerDbm: 18 } };
    mockApi([
      { path: '/auth/me', body: demoEngineer },
      { path: `/links/${LINK_ID}`, body: linkDetailOf(theirs, 3) },
      { path: '/equipment', body: emptyList },
    ]);
    renderApp(`/links/${LINK_ID}`);
    expect(await screen.findByTestId('rebase-notice', {}, { timeout: 8000 })).toHaveTextContent('Now editing on top of revision 3');
    expect(rangeInput().value).toBe('2.5 km');
    expect(powerInput().value).toBe('18 dBm');
    expect(screen.getByRole('button', { name: 'Save as revision 4' })).toBeEnabled();
  });
});

describe('link workspace (read-only roles)', () => {
  it.each(['installer', 'reviewer'])('gives the %s the design without a single edit control', async (role) => {
    mockApi(baseRoutes(role));
    renderApp(`/links/${LINK_ID}`);
    expect(await screen.findByTestId('design-readout', {}, { timeout: 8000 })).toBeInTheDocument();
    expect(screen.getByTestId('link-margin')).toBeInTheDocument();
    const main = document.querySelector('main')!;
    expect(main.querySelectorAll('input, textarea, select')).toHaveLength(0);
    expect(screen.queryByRole('button', { name: /save/i })).not.toBeInTheDocument();
    expect(screen.getByTestId('eye-safety-caution')).toBeInTheDocument();
  });
});

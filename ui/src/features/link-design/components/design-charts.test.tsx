import { describe, expect, it, vi } from 'vitest';
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { FluentProvider } from '@fluentui/react-components';
import { evaluateLink } from '@beamwright/link-core';
import { DesignCharts } from '@/features/link-design/components/design-charts';
import { workedExampleDesign } from '@/testing/designs';
import { lightTheme } from '@/lib/theme';

// ECharts cannot draw in jsdom: the stand-in keeps the option each chart was given, so the test
// can hold the table under each chart against the very points the chart plots.
const plotted = vi.hoisted(() => new Map<string, { series: { data: [number, number][] }[] }>());
vi.mock('@/components/charts/lazy-echart', () => ({
  LazyEChart: ({ ariaLabel, testId, option }: { ariaLabel: string; testId: string; option: { series: { data: [number, number][] }[] } }) => {
    plotted.set(testId, option);
    return <div role="img" aria-label={ariaLabel} data-testid={testId} />;
  },
}));

/** A table cell back to a number ("−12.3" uses a true minus sign). */
const readNumber = (text: string) => Number(text.replace('\u2212', '-'));

describe('chart text alternatives', () => {
  const budget = evaluateLink(workedExampleDesign);

  it.each([
    { chart: 'chart-beam', name: 'Beam radius along the path against the receive aperture', columns: [0, 1], header: /Distance from the transmitter \(km\).*Beam 1\/e² radius \((mm|m)\)/ },
    { chart: 'chart-range', name: 'Link margin against path length', columns: [0, 1], header: /Path length \(km\).*Link margin \(dB\).*Verdict/ },
    { chart: 'chart-visibility', name: 'Link margin against visibility', columns: [0, 2], header: /Visibility \(km\).*Weather.*Link margin \(dB\).*Verdict/ },
  ])('$chart has an accessible name and a table holding every plotted point', async ({ chart, name, columns, header }) => {
    render(
      <FluentProvider theme={lightTheme}>
        <DesignCharts design={workedExampleDesign} budget={budget} requiredMarginDb={3} />
      </FluentProvider>,
    );
    expect(screen.getByRole('img', { name })).toHaveAttribute('data-testid', chart);

    const card = screen.getByTestId(chart).closest('section')!;
    await userEvent.click(within(card).getByRole('button', { name: /Show the values as a table/ }));
    const table = await screen.findByTestId(`${chart}-table`);
    expect(table).toHaveAccessibleName(/the values plotted/);
    const rows = within(table).getAllByRole('row');
    expect(rows[0]).toHaveTextContent(header);

    const points = plotted.get(chart)!.series[0]!.data;
    expect(points.length).toBeGreaterThan(50);
    expect(rows.length - 1).toBe(points.length);
    points.forEach(([x, y], index) => {
      const cells = within(rows[index + 1]!).getAllByRole('cell').map((cell) => cell.textContent ?? '');
      // the table rounds to four significant figures: within half a unit of the fourth figure
      expect(Math.abs(readNumber(cells[columns[0]!]!) - x)).toBeLessThanOrEqual(Math.abs(x) * 5e-4 + 1e-12);
      expect(Math.abs(readNumber(cells[columns[1]!]!) - y)).toBeLessThanOrEqual(Math.abs(y) * 5e-4 + 1e-12);
    });
  });

  it('lists the long-term radius of the Gaussian-beam model beside the beam radius, from the points it plots', async () => {
    render(
      <FluentProvider theme={lightTheme}>
        <DesignCharts design={workedExampleDesign} budget={budget} requiredMarginDb={3} />
      </FluentProvider>,
    );
    const card = screen.getByTestId('chart-beam').closest('section')!;
    await userEvent.click(within(card).getByRole('button', { name: /Show the values as a table/ }));
    const rows = within(await screen.findByTestId('chart-beam-table')).getAllByRole('row');
    expect(rows[0]).toHaveTextContent(/Long-term 1\/e² radius in turbulence \((mm|m)\)/);
    const series = plotted.get('chart-beam')!.series as unknown as { name: string; data: [number, number][] }[];
    const longTerm = series.find((entry) => entry.name === 'Long-term radius (turbulence)')!.data;
    expect(rows.length - 1).toBe(longTerm.length);
    longTerm.forEach(([, radius], index) => {
      const cell = within(rows[index + 1]!).getAllByRole('cell')[2]!.textContent ?? '';
      expect(Math.abs(readNumber(cell) - radius)).toBeLessThanOrEqual(Math.abs(radius) * 5e-4 + 1e-12);
    });
  });

  it('gives every margin in the tables its verdict word, as the headline does', async () => {
    const far = { ...workedExampleDesign, rangeM: 4000 };
    render(
      <FluentProvider theme={lightTheme}>
        <DesignCharts design={far} budget={evaluateLink(far)} requiredMarginDb={3} />
      </FluentProvider>,
    );
    const card = screen.getByTestId('chart-range').closest('section')!;
    await userEvent.click(within(card).getByRole('button', { name: /Show the values as a table/ }));
    const rows = within(await screen.findByTestId('chart-range-table')).getAllByRole('row').slice(1);
    const verdicts = new Set(rows.map((row) => within(row).getAllByRole('cell')[2]!.textContent));
    // the sweep runs to twice the design range, past the point where the link fails
    expect(verdicts).toEqual(new Set(['Adequate', 'Thin', 'Fails']));
    for (const row of rows) {
      const [, margin, verdict] = within(row).getAllByRole('cell').map((cell) => cell.textContent ?? '');
      const value = readNumber(margin!);
      expect(verdict).toBe(value < 0 ? 'Fails' : value < 3 ? 'Thin' : 'Adequate');
    }
  });
});

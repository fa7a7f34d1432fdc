import { describe, expect, it, vi } from 'vitest';
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { FluentProvider } from '@fluentui/react-components';
import { evaluateLink } from '@beamwright/link-core';
import { MarginExplorer } from '@/features/explore/components/margin-explorer';
import { workedExampleDesign } from '@/testing/designs';
import { lightTheme } from '@/lib/theme';

// ECharts cannot draw in jsdom: the stand-in keeps the option each chart was given.
const plotted = vi.hoisted(() => new Map<string, { series: { type: string; data: number[][] }[] }>());
vi.mock('@/components/charts/lazy-echart', () => ({
  LazyEChart: ({ ariaLabel, testId, option }: { ariaLabel: string; testId: string; option: { series: { type: string; data: number[][] }[] } }) => {
    plotted.set(testId, option);
    return <div role="img" aria-label={ariaLabel} data-testid={testId} />;
  },
}));

const renderExplorer = () =>
  render(
    <FluentProvider theme={lightTheme}>
      <MarginExplorer design={workedExampleDesign} requiredMarginDb={3} />
    </FluentProvider>,
  );

describe('margin explorer', () => {
  it('plots the engine’s margin against the path length by default', async () => {
    renderExplorer();
    const result = await screen.findByTestId('explore-result');
    expect(result).toHaveAttribute('data-kind', 'line');
    expect(result).toHaveAttribute('data-count', '121');
    const line = plotted.get('chart-explore')!.series[0]!.data as [number, number][];
    // each plotted sample (km on the axis) is the engine's margin of the design at that range
    for (const index of [0, 60, 120]) {
      const [rangeKm, marginDb] = line[index]!;
      expect(marginDb).toBeCloseTo(evaluateLink({ ...workedExampleDesign, rangeM: rangeKm * 1000 }).linkMarginDb, 9);
    }
    expect(screen.getByTestId('explore-status')).toHaveTextContent(/121 budgets in \d+ ms/);
  });

  it('draws a heat map over two inputs and refuses a bad setting next to its field', async () => {
    const user = userEvent.setup();
    renderExplorer();
    await screen.findByTestId('explore-result');
    await user.click(screen.getByTestId('explore-mode-grid'));
    await waitFor(() => expect(screen.getByTestId('explore-result')).toHaveAttribute('data-kind', 'grid'));
    expect(screen.getByTestId('explore-result')).toHaveAttribute('data-count', String(60 * 40));
    const series = plotted.get('chart-explore')!.series;
    expect(series[0]!.type).toBe('custom');
    expect(series[0]!.data.length).toBe(60 * 40);

    const from = screen.getByTestId('explore-y-from');
    await user.clear(from);
    await user.type(from, '-2');
    const group = screen.getByRole('group', { name: 'Vertical input' });
    expect(await within(group).findByText('From must be above 0 on a logarithmic scale')).toBeInTheDocument();
    // the last good heat map stays on screen while the setting is wrong
    expect(screen.getByTestId('explore-result')).toHaveAttribute('data-kind', 'grid');
  });
});

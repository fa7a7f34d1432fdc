import { describe, expect, it, vi } from 'vitest';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { FluentProvider } from '@fluentui/react-components';
import { evaluateLink, solveDesign } from '@beamwright/link-core';
import { SizeIt } from '@/features/explore/components/size-it';
import { workedExampleDesign } from '@/testing/designs';
import { lightTheme } from '@/lib/theme';

const renderSizeIt = (props: Partial<Parameters<typeof SizeIt>[0]> = {}) => {
  const onUse = vi.fn();
  render(
    <FluentProvider theme={lightTheme}>
      <SizeIt vary="powerDbm" design={workedExampleDesign} requiredMarginDb={3} onUse={onUse} {...props} />
    </FluentProvider>,
  );
  return onUse;
};

describe('size it for me', () => {
  it('finds the least power for the required margin and hands it to the form', async () => {
    const user = userEvent.setup();
    const onUse = renderSizeIt();
    await user.click(screen.getByTestId('size-it-powerDbm'));
    const card = await screen.findByTestId('size-it-result-powerDbm');
    const expected = solveDesign(workedExampleDesign, { vary: 'powerDbm', requiredMarginDb: 3 });
    expect(expected.achievable).toBe(true);
    expect(card).toHaveAttribute('data-achievable', 'true');
    expect(card).toHaveTextContent(`It leaves a margin of ${expected.marginDb.toFixed(2)} dB`);
    await user.click(screen.getByTestId('size-it-use-powerDbm'));
    expect(onUse).toHaveBeenCalledWith(expected.value);
    // the power it found really gives the required margin (to the solver's 0.01 dB)
    const margin = evaluateLink({ ...workedExampleDesign, transmitter: { ...workedExampleDesign.transmitter, powerDbm: expected.value! } }).linkMarginDb;
    expect(Math.abs(margin - 3)).toBeLessThanOrEqual(0.01);
  });

  it('says when no value in the allowed range reaches the margin, and what limits it', async () => {
    const user = userEvent.setup();
    renderSizeIt({ requiredMarginDb: 200 });
    await user.click(screen.getByTestId('size-it-powerDbm'));
    const card = await screen.findByTestId('size-it-result-powerDbm');
    expect(card).toHaveAttribute('data-achievable', 'false');
    expect(card).toHaveTextContent(/Not achievable: no transmit power in the allowed range reaches 200 dB/);
    expect(card).toHaveTextContent(/what limits it: /);
    expect(screen.queryByTestId('size-it-use-powerDbm')).toBeNull();
  });
});

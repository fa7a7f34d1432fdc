import { describe, expect, it, vi } from 'vitest';
import { fireEvent, render, screen } from '@testing-library/react';
import { FluentProvider, webLightTheme } from '@fluentui/react-components';
import { evaluateLink, type LinkDesignInput } from '@beamwright/link-core';
import { DesignResults } from '@/features/link-design/components/design-results';

// Jitter of 400 µrad on a 2 km link: the mean pointing loss looks mild, the 0.1 % loss is not.
const jittery: LinkDesignInput = {
  rangeM: 2000,
  transmitter: { wavelengthM: 1.55e-6, powerDbm: 20, waistRadiusM: 0.025, halfAngleDivergenceRad: 1e-3, opticsLossDb: 1 },
  receiver: { apertureDiameterM: 0.1, sensitivityDbm: -36, opticsLossDb: 1.5 },
  pointing: { jitterSigmaPerAxisRad: 400e-6, staticErrorRad: 100e-6 },
  atmosphere: { model: 'kim', visibilityM: 5000, cn2: 5e-14 },
  scintillation: { include: false },
};

describe('DesignResults', () => {
  it('offers outage pointing in one click beside the warning that the mean hides outages', () => {
    const budget = evaluateLink(jittery);
    expect(budget.checks.map((check) => check.key)).toContain('pointing-mean-hides-outage');
    const useOutage = vi.fn();
    render(
      <FluentProvider theme={webLightTheme}>
        <DesignResults design={jittery} budget={budget} onUseOutagePointing={useOutage} />
      </FluentProvider>,
    );
    expect(screen.getByText(/hides outages/)).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: /use outage pointing/i }));
    expect(useOutage).toHaveBeenCalledTimes(1);
  });
});

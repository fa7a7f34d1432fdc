import { useMemo } from 'react';
import { makeStyles, tokens } from '@fluentui/react-components';
import { ChartCard } from '@/components/charts/chart-card';
import {
  beamEnvelope,
  marginVsRange,
  marginVsVisibility,
  type LinkBudget,
  type LinkDesignInput,
} from '@beamwright/link-core';
import { LazyEChart } from '@/components/charts/lazy-echart';
import { useThemeMode } from '@/lib/theme';
import { formatDistance, formatLength } from '@/lib/format';
import { waterfallOption } from '@/features/link-design/charts/waterfall-chart';
import { beamEnvelopeData, beamEnvelopeOption } from '@/features/link-design/charts/beam-envelope-chart';
import { marginVsRangeData, marginVsRangeOption, marginVsVisibilityData, marginVsVisibilityOption } from '@/features/link-design/charts/margin-charts';
import { VISIBILITY_BANDS } from '@/features/link-design/charts/visibility-bands';

const useStyles = makeStyles({
  // min(…, 100%): on a narrow screen the cards stack and shrink instead of overflowing
  grid: { display: 'grid', gridTemplateColumns: 'repeat(auto-fit, minmax(min(440px, 100%), 1fr))', gap: tokens.spacingHorizontalL },
});

export function BudgetWaterfall({ budget }: { budget: LinkBudget }) {
  const [mode] = useThemeMode();
  const option = useMemo(() => waterfallOption(budget, mode), [budget, mode]);
  return (
    <ChartCard title="From transmit power to margin" caption="Each bar is one term of the budget in dBm; the last bar is the margin above the receiver sensitivity (dashed line). The link budget table lists the same terms with their values.">
      <LazyEChart option={option} ariaLabel="Waterfall of the link budget from transmit power to link margin" height={300} testId="chart-waterfall" />
    </ChartCard>
  );
}

export interface DesignChartsProps {
  design: LinkDesignInput;
  budget: LinkBudget;
  requiredMarginDb: number;
}

/** Beam envelope, margin against range and margin against visibility, from the (deferred) design. */
export function DesignCharts({ design, budget, requiredMarginDb }: DesignChartsProps) {
  const styles = useStyles();
  const [mode] = useThemeMode();
  const series = useMemo(() => {
    try {
      return {
        envelope: beamEnvelope(design, { points: 121 }),
        range: marginVsRange(design, { points: 121 }),
        visibility: marginVsVisibility(design, { points: 81 }),
      };
    } catch {
      return null;
    }
  }, [design]);
  const tables = useMemo(
    () =>
      series && {
        envelope: beamEnvelopeData(series.envelope),
        range: marginVsRangeData(series.range),
        visibility: marginVsVisibilityData(series.visibility, VISIBILITY_BANDS),
      },
    [series],
  );
  const options = useMemo(
    () =>
      series && {
        envelope: beamEnvelopeOption(series.envelope, mode),
        range: marginVsRangeOption(series.range, design.rangeM, requiredMarginDb, mode),
        visibility: marginVsVisibilityOption(series.visibility, design.atmosphere.visibilityM, mode, VISIBILITY_BANDS),
      },
    [series, mode, design, requiredMarginDb],
  );
  if (!series || !options || !tables) return null;
  const { envelope } = series;
  const rayleighText = envelope.rayleighRangeEndWithinPath
    ? `The dashed line marks where the Rayleigh range ends (${formatDistance(envelope.rayleighRangeEndM)} from the transmitter); beyond it the beam widens almost linearly with distance.`
    : envelope.rayleighRangeEndM > 0
      ? `Rayleigh range ${formatDistance(envelope.rayleighRangeM)}: it ends beyond the receiver, so the beam stays near its waist over the whole path.`
      : `The beam is launched diverging (virtual waist ${formatDistance(-envelope.waistPositionM)} behind the aperture, Rayleigh range ${formatDistance(envelope.rayleighRangeM)}), so it widens from the start.`;

  return (
    <div className={styles.grid}>
      <ChartCard
        title="Beam along the path"
        caption={`${rayleighText} Receive aperture radius ${formatLength(envelope.receiveApertureRadiusM)}; beam 1/e² radius at the receiver ${formatLength(budget.beamRadiusAtReceiverM)}.${envelope.longTermBeamRadiusM ? ` The dashed violet line is the long-term radius in turbulence (beam spread and wander, Gaussian-beam model): ${formatLength(envelope.longTermBeamRadiusM[envelope.longTermBeamRadiusM.length - 1]!)} at the receiver.` : ''}`}
        data={tables.envelope}
        testId="chart-beam"
      >
        <LazyEChart option={options.envelope} ariaLabel="Beam radius along the path against the receive aperture" testId="chart-beam" />
      </ChartCard>
      <ChartCard
        title="Margin against path length"
        caption="Everything but the path length as designed. The shaded band is where the link fails."
        data={tables.range}
        testId="chart-range"
      >
        <LazyEChart option={options.range} ariaLabel="Link margin against path length" testId="chart-range" />
      </ChartCard>
      <ChartCard
        title="Margin against visibility"
        caption="Everything but the visibility as designed, in the visibility definition chosen. Bands: international visibility code."
        data={tables.visibility}
        testId="chart-visibility"
      >
        <LazyEChart option={options.visibility} ariaLabel="Link margin against visibility" testId="chart-visibility" />
      </ChartCard>
    </div>
  );
}

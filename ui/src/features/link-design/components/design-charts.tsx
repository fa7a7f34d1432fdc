import { useMemo, type ReactNode } from 'react';
import {
  Accordion,
  AccordionHeader,
  AccordionItem,
  AccordionPanel,
  Caption1,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
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
import type { ChartData } from '@/features/link-design/charts/chart-format';
import { waterfallOption } from '@/features/link-design/charts/waterfall-chart';
import { beamEnvelopeData, beamEnvelopeOption } from '@/features/link-design/charts/beam-envelope-chart';
import { marginVsRangeData, marginVsRangeOption, marginVsVisibilityData, marginVsVisibilityOption } from '@/features/link-design/charts/margin-charts';
import { VISIBILITY_BANDS } from '@/features/link-design/charts/visibility-bands';

const useStyles = makeStyles({
  // min(…, 100%): on a narrow screen the cards stack and shrink instead of overflowing
  grid: { display: 'grid', gridTemplateColumns: 'repeat(auto-fit, minmax(min(440px, 100%), 1fr))', gap: tokens.spacingHorizontalL },
  card: {
    backgroundColor: tokens.colorNeutralBackground1,
    border: `1px solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusLarge,
    padding: tokens.spacingHorizontalM,
    display: 'grid',
    rowGap: tokens.spacingVerticalXS,
    minWidth: 0,
  },
  caption: { color: tokens.colorNeutralForeground3 },
  tableScroll: { maxHeight: '320px', overflowY: 'auto', overflowX: 'auto' },
  number: { fontVariantNumeric: 'tabular-nums', textAlign: 'end' },
});

/** A plotted number as the table shows it: four significant figures, a true minus sign. */
export function formatPlottedValue(value: number | string): string {
  if (typeof value === 'string') return value;
  if (!Number.isFinite(value)) return '—';
  const text = String(Number(value.toPrecision(4)));
  return text.startsWith('-') ? `\u2212${text.slice(1)}` : text;
}

/** The chart's values as a table, for screen readers and for anyone who wants the numbers. */
function ChartValuesTable({ title, data, testId }: { title: string; data: ChartData; testId: string }) {
  const styles = useStyles();
  return (
    <Accordion collapsible>
      <AccordionItem value="table">
        <AccordionHeader size="small">Show the values as a table ({data.rows.length} rows)</AccordionHeader>
        <AccordionPanel>
          {/* focusable so that keyboard users can scroll it (WCAG 2.1.1) */}
          <div className={styles.tableScroll} tabIndex={0} role="region" aria-label={`${title}: values`}>
            <Table size="extra-small" aria-label={`${title}: the values plotted`} data-testid={`${testId}-table`}>
              <TableHeader>
                <TableRow>
                  {data.columns.map((column) => (
                    <TableHeaderCell key={column}>{column}</TableHeaderCell>
                  ))}
                </TableRow>
              </TableHeader>
              <TableBody>
                {data.rows.map((row, rowIndex) => (
                  <TableRow key={rowIndex}>
                    {row.map((cell, cellIndex) => (
                      <TableCell key={cellIndex} className={typeof cell === 'number' ? styles.number : undefined}>
                        {formatPlottedValue(cell)}
                      </TableCell>
                    ))}
                  </TableRow>
                ))}
              </TableBody>
            </Table>
          </div>
        </AccordionPanel>
      </AccordionItem>
    </Accordion>
  );
}

function ChartCard({ title, caption, children, data, testId }: { title: string; caption: ReactNode; children: ReactNode; data?: ChartData; testId?: string }) {
  const styles = useStyles();
  return (
    <section className={styles.card} aria-label={title}>
      <Subtitle2 as="h3">{title}</Subtitle2>
      {children}
      <Caption1 className={styles.caption}>{caption}</Caption1>
      {data && testId && <ChartValuesTable title={title} data={data} testId={testId} />}
    </section>
  );
}

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

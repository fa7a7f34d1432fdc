import { useMemo } from 'react';
import {
  Caption1,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  Text,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { HOURS_PER_YEAR, VISIBILITY_DEFINITION_LABELS, type RevisionAvailability } from '@beamwright/link-core/contracts';
import { LazyEChart } from '@/components/charts/lazy-echart';
import { formatDateTime, formatDb, formatDistance } from '@/lib/format';
import { useThemeMode } from '@/lib/theme';
import {
  availabilityRangeOption,
  availabilityRangeTable,
  marginDistributionOption,
  marginDistributionTable,
  monthlyAvailabilityOption,
  monthlyAvailabilityTable,
  percentText,
} from '@/features/weather/charts/availability-charts';
import { AvailabilityMethodNote } from '@/features/weather/components/availability-method-note';
import { ChartCard } from '@/components/charts/chart-card';
import { RangeTargets } from '@/features/weather/components/range-targets';

const useStyles = makeStyles({
  root: { display: 'grid', rowGap: tokens.spacingVerticalL, minWidth: 0 },
  figures: { display: 'grid', gridTemplateColumns: 'repeat(auto-fit, minmax(min(180px, 100%), 1fr))', gap: tokens.spacingHorizontalM },
  figure: {
    display: 'grid',
    rowGap: tokens.spacingVerticalXXS,
    padding: tokens.spacingHorizontalM,
    borderRadius: tokens.borderRadiusMedium,
    backgroundColor: tokens.colorNeutralBackground2,
  },
  value: { fontSize: tokens.fontSizeBase500, fontWeight: tokens.fontWeightSemibold, fontVariantNumeric: 'tabular-nums' },
  muted: { color: tokens.colorNeutralForeground3 },
  charts: { display: 'grid', gridTemplateColumns: 'repeat(auto-fit, minmax(min(440px, 100%), 1fr))', gap: tokens.spacingHorizontalL },
  section: { display: 'grid', rowGap: tokens.spacingVerticalS, minWidth: 0 },
});

function Figure({ label, value, detail, testId }: { label: string; value: string; detail?: string; testId?: string }) {
  const styles = useStyles();
  return (
    <div className={styles.figure} data-testid={testId}>
      <Caption1 className={styles.muted}>{label}</Caption1>
      <Text className={styles.value}>{value}</Text>
      {detail && <Caption1 className={styles.muted}>{detail}</Caption1>}
    </div>
  );
}

/** The availability of a revision over a data set: the figures, the three charts, the outages and the method. */
export function AvailabilityResults({ availability, designRangeM }: { availability: RevisionAvailability; designRangeM: number }) {
  const styles = useStyles();
  const [mode] = useThemeMode();
  const definition = availability.visibilityDefinition === 'mor-5-percent' ? 'MOR' : '2 % visibility';
  const charts = useMemo(
    () => ({
      months: { option: monthlyAvailabilityOption(availability.months, mode), table: monthlyAvailabilityTable(availability.months) },
      range: availability.availabilityAgainstRange && {
        option: availabilityRangeOption(availability.availabilityAgainstRange, availability.rangesForAvailability ?? [], designRangeM, mode),
        table: availabilityRangeTable(availability.availabilityAgainstRange),
      },
      margins: { option: marginDistributionOption(availability.marginDistribution, availability.requiredMarginDb, mode), table: marginDistributionTable(availability.marginDistribution, availability.coveredHours) },
    }),
    [availability, designRangeM, mode],
  );
  const years = availability.coveredHours / HOURS_PER_YEAR;
  const exceeded = (share: number) => availability.marginDistribution.exceeded.find((entry) => entry.share === share)?.marginDb ?? null;

  return (
    <div className={styles.root} data-testid="availability-results">
      {/* the headline is announced when the choice of data, revision or margin changes it */}
      <div className={styles.figures} aria-live="polite">
        <Figure label="Availability" value={percentText(availability.availability)} detail={`over ${availability.coveredHours.toLocaleString('en-GB')} h of records (${years.toFixed(1)} years)`} testId="availability-headline" />
        <Figure
          label="Downtime per year"
          value={availability.annualDowntimeH === null ? '—' : `${availability.annualDowntimeH.toFixed(1)} h`}
          detail={`${availability.unavailableHours.toLocaleString('en-GB')} h down in the records`}
        />
        <Figure
          label="Fails below a visibility of"
          value={availability.minimumVisibilityM === null ? 'any visibility' : formatDistance(availability.minimumVisibilityM)}
          detail={`${definition}, with ${formatDb(availability.requiredMarginDb)} required`}
          testId="availability-minimum-visibility"
        />
        <Figure label="Outages" value={String(availability.outageCount)} detail={`longest ${availability.longestOutageH.toFixed(0)} h`} />
        <Figure label="Clear-air margin" value={formatDb(availability.clearAirMarginDb, { digits: 1 })} detail="no weather loss, no fade margin" />
        <Figure
          label="Margin exceeded 99 % of the time"
          value={formatDb(exceeded(0.99), { digits: 1 })}
          detail={`99.9 %: ${formatDb(exceeded(0.999), { digits: 1 })}`}
        />
      </div>
      <AvailabilityMethodNote method={availability.method} testId="availability-method" />

      <section className={styles.section} aria-labelledby="availability-ranges-heading">
        <Subtitle2 as="h3" id="availability-ranges-heading">
          Availability against path length
        </Subtitle2>
        {availability.rangesForAvailability ? (
          <RangeTargets ranges={availability.rangesForAvailability} visibilityLabel={`Deciding visibility (${definition})`} testId="availability-ranges" />
        ) : (
          <Caption1>Below 550 nm with the Kim or Kruse model the attenuation does not fall with visibility, so no single path length can be given.</Caption1>
        )}
      </section>

      <div className={styles.charts}>
        <ChartCard
          title="Availability per month"
          caption={`Each bar pools one calendar month over every year of the data set (UTC). ${availability.months.length < 12 ? 'Months without records are left out.' : ''}`}
          data={charts.months.table}
          testId="chart-availability-months"
        >
          <LazyEChart option={charts.months.option} ariaLabel="Availability per calendar month, in percent" testId="chart-availability-months" />
        </ChartCard>
        {charts.range && (
          <ChartCard
            title="Availability against path length"
            caption="Everything but the path length as designed, over the same records; dashed lines: 99 %, 99.9 % and 99.99 %; the orange line is this design's path."
            data={charts.range.table}
            testId="chart-availability-range"
          >
            <LazyEChart option={charts.range.option} ariaLabel="Availability in percent against path length in kilometres" testId="chart-availability-range" />
          </ChartCard>
        )}
        <ChartCard
          title="Distribution of the margin"
          caption={`Hours per ${availability.marginDistribution.binWidthDb} dB bin of the margin left after the visibility loss (log scale). Bins under the required margin are the outage hours (red); the table gives every bin.`}
          data={charts.margins.table}
          testId="chart-availability-margins"
        >
          <LazyEChart option={charts.margins.option} ariaLabel="Hours per bin of the margin left after the weather" testId="chart-availability-margins" />
        </ChartCard>
      </div>

      {availability.longestOutages.length > 0 && (
        <section className={styles.section} aria-labelledby="availability-outages-heading">
          <Subtitle2 as="h3" id="availability-outages-heading">
            Longest outages
          </Subtitle2>
          <Table size="small" aria-label="Longest outages" data-testid="availability-outages">
            <TableHeader>
              <TableRow>
                <TableHeaderCell>Starts</TableHeaderCell>
                <TableHeaderCell>Length</TableHeaderCell>
                <TableHeaderCell>Lowest visibility ({definition})</TableHeaderCell>
              </TableRow>
            </TableHeader>
            <TableBody>
              {availability.longestOutages.map((outage) => (
                <TableRow key={`${outage.startsAt}-${outage.durationH}`}>
                  <TableCell>{formatDateTime(outage.startsAt)}</TableCell>
                  <TableCell>{outage.durationH.toFixed(0)} h</TableCell>
                  <TableCell>{formatDistance(outage.lowestVisibilityM)}</TableCell>
                </TableRow>
              ))}
            </TableBody>
          </Table>
        </section>
      )}
      <Caption1 className={styles.muted}>Visibility figures are in the data set&apos;s definition: {VISIBILITY_DEFINITION_LABELS[availability.visibilityDefinition]}.</Caption1>
    </div>
  );
}

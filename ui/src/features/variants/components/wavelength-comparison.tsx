import { useMemo } from 'react';
import { Caption1, Subtitle2, Table, TableBody, TableCell, TableHeader, TableHeaderCell, TableRow, makeStyles, tokens } from '@fluentui/react-components';
import { compareWavelengths, type LinkDesignInput } from '@beamwright/link-core';
import { ChartCard } from '@/components/charts/chart-card';
import { LazyEChart } from '@/components/charts/lazy-echart';
import { useThemeMode } from '@/lib/theme';
import { formatComparedValue } from '@/features/variants/components/comparison-table';
import { wavelengthChartData, wavelengthChartOption, wavelengthName } from '@/features/variants/charts/wavelength-chart';

const useStyles = makeStyles({
  root: { display: 'grid', rowGap: tokens.spacingVerticalS, minWidth: 0 },
  scroll: { overflowX: 'auto' },
  number: { textAlign: 'end', fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap' },
  muted: { color: tokens.colorNeutralForeground3 },
});

/** The same optics at each usual wavelength, as numbers and as one chart (margin against visibility). */
export function WavelengthComparisonView({ design, requiredMarginDb }: { design: LinkDesignInput; requiredMarginDb: number }) {
  const styles = useStyles();
  const [mode] = useThemeMode();
  const comparison = useMemo(() => {
    try {
      return compareWavelengths(design);
    } catch {
      return null;
    }
  }, [design]);
  if (!comparison) return <Caption1>The wavelength comparison could not be computed for this design.</Caption1>;

  const weather = comparison.referenceWeather;
  const rows: { label: string; unit: string; values: (number | string | null)[] }[] = [
    { label: 'Divergence (half-angle, as used)', unit: 'mrad', values: comparison.rows.map((row) => row.halfAngleDivergenceRad * 1e3) },
    { label: 'Diffraction limit', unit: 'mrad', values: comparison.rows.map((row) => row.diffractionHalfAngleRad * 1e3) },
    { label: 'Beam radius at the receiver', unit: 'm', values: comparison.rows.map((row) => row.beamRadiusAtReceiverM) },
    { label: 'Geometric loss', unit: 'dB', values: comparison.rows.map((row) => row.geometricLossDb) },
    { label: 'Attenuation at the design visibility', unit: 'dB/km', values: comparison.rows.map((row) => row.specificAttenuationDbPerKm) },
    ...weather.map((condition, index) => ({
      label: `Attenuation in ${condition.label.toLowerCase()} (${Number((condition.visibilityM / 1000).toPrecision(3))} km)`,
      unit: 'dB/km',
      values: comparison.rows.map((row) => row.referenceAttenuationDbPerKm[index] ?? null),
    })),
    { label: 'Rytov variance (spherical wave)', unit: '', values: comparison.rows.map((row) => row.rytovVarianceSpherical) },
    { label: 'Fade margin (scintillation)', unit: 'dB', values: comparison.rows.map((row) => row.scintillationFadeMarginDb) },
    { label: 'MPE at the cornea', unit: 'W/m²', values: comparison.rows.map((row) => row.eyeSafety?.mpeWPerM2 ?? 'not assessed') },
    { label: 'Indicative laser class', unit: '', values: comparison.rows.map((row) => row.eyeSafety?.indicativeClass ?? 'not assessed') },
    { label: 'NOHD, naked eye', unit: 'm', values: comparison.rows.map((row) => row.eyeSafety?.nohdUnaidedM ?? 'not assessed') },
    { label: 'Link margin', unit: 'dB', values: comparison.rows.map((row) => row.linkMarginDb) },
  ];
  const caution = comparison.rows.find((row) => row.eyeSafety)?.eyeSafety?.caution;

  return (
    <section className={styles.root} aria-label="Wavelength comparison">
      <Subtitle2 as="h3">The same optics at each wavelength</Subtitle2>
      <div className={styles.scroll} tabIndex={0} role="region" aria-label="Wavelength comparison table">
        <Table size="small" aria-label="The same optics at each wavelength" data-testid="wavelength-table">
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Quantity</TableHeaderCell>
              {comparison.rows.map((row) => (
                <TableHeaderCell key={row.wavelengthM} className={styles.number}>
                  {wavelengthName(row.wavelengthM)}
                </TableHeaderCell>
              ))}
            </TableRow>
          </TableHeader>
          <TableBody>
            {rows.map((row) => (
              <TableRow key={row.label}>
                <TableCell>
                  {row.label}
                  {row.unit ? ` (${row.unit})` : ''}
                </TableCell>
                {row.values.map((value, index) => (
                  <TableCell key={index} className={styles.number}>
                    {formatComparedValue(value, row.unit === 'dB' ? 'dB' : row.unit)}
                  </TableCell>
                ))}
              </TableRow>
            ))}
          </TableBody>
        </Table>
      </div>
      {caution && <Caption1 className={styles.muted}>{caution}</Caption1>}
      {comparison.notes.map((note) => (
        <Caption1 key={note} className={styles.muted}>
          {note}
        </Caption1>
      ))}
      <ChartCard
        title="Margin against visibility, per wavelength"
        caption="Everything but the wavelength and the visibility as designed; one line per wavelength, told apart by colour and dash."
        data={wavelengthChartData(comparison)}
        testId="chart-wavelengths"
      >
        <LazyEChart option={wavelengthChartOption(comparison, design.atmosphere.visibilityM, requiredMarginDb, mode)} ariaLabel="Link margin against visibility, one line per wavelength" testId="chart-wavelengths" />
      </ChartCard>
    </section>
  );
}

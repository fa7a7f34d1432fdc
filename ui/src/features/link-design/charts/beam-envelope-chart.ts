// ECharts option of the beam envelope along the path, with the receive aperture, the Rayleigh range
// and (Gaussian-beam turbulence model) the long-term radius. Pure, like every chart option here.
import type { BeamEnvelope } from '@beamwright/link-core';
import type { ChartOption } from '@/components/charts/echart';
import { CHART_TEXT, axisStyle, type ChartMode } from '@/components/charts/chart-theme';
import { beamPalette } from '@/lib/theme';
import { distanceAxis, niceLimit, type ChartData } from '@/components/charts/chart-format';

/** Legend name of the long-term (turbulence-spread) radius series. */
export const LONG_TERM_RADIUS_NAME = 'Long-term radius (turbulence)';
// violet, dashed: told from the beam's amber fill by the dash as well as the colour
const LONG_TERM_COLOUR = '#8b5cf6';

/**
 * The beam's upper edge as plotted: distance in km (or m) against the 1/e² radius in mm (or m),
 * and, with the Gaussian-beam turbulence model, the long-term radius at the same distances.
 */
export function beamEnvelopePoints(envelope: BeamEnvelope) {
  const rangeM = envelope.distanceM[envelope.distanceM.length - 1] ?? 0;
  const x = distanceAxis(rangeM);
  const largest = Math.max(...envelope.beamRadiusM, ...(envelope.longTermBeamRadiusM ?? []), envelope.receiveApertureRadiusM);
  const y = largest < 0.5 ? { unit: 'mm', factor: 1e3 } : { unit: 'm', factor: 1 };
  const points = envelope.distanceM.map((distance, index) => [distance * x.factor, envelope.beamRadiusM[index]! * y.factor] as [number, number]);
  const longTerm = envelope.longTermBeamRadiusM?.map((radius, index) => [envelope.distanceM[index]! * x.factor, radius * y.factor] as [number, number]);
  return { rangeM, largest, x, y, points, longTerm };
}

export function beamEnvelopeData(envelope: BeamEnvelope): ChartData {
  const { x, y, points, longTerm } = beamEnvelopePoints(envelope);
  const columns = [`Distance from the transmitter (${x.unit})`, `Beam 1/e² radius (${y.unit})`];
  if (!longTerm) return { columns, rows: points };
  return {
    columns: [...columns, `Long-term 1/e² radius in turbulence (${y.unit})`],
    rows: points.map(([distance, radius], index) => [distance, radius, longTerm[index]![1]]),
  };
}

export function beamEnvelopeOption(envelope: BeamEnvelope, mode: ChartMode): ChartOption {
  const { rangeM, largest, x, y, points: upper, longTerm } = beamEnvelopePoints(envelope);
  const text = CHART_TEXT[mode];
  const lower = upper.map(([distance, radius]) => [distance!, -radius!]);
  const apertureRadius = envelope.receiveApertureRadiusM * y.factor;
  const markLines: unknown[] = [
    [
      { coord: [rangeM * x.factor, -apertureRadius], lineStyle: { color: beamPalette.aperture, width: 5, type: 'solid' } },
      { coord: [rangeM * x.factor, apertureRadius], label: { formatter: 'receive\naperture', position: 'end', color: text.text } },
    ],
  ];
  if (envelope.rayleighRangeEndWithinPath) {
    markLines.push({
      xAxis: envelope.rayleighRangeEndM * x.factor,
      lineStyle: { color: text.muted, type: 'dashed' },
      label: { formatter: 'Rayleigh range', position: 'insideEndTop', color: text.muted },
    });
  }
  // Gaussian-beam model with Cn² > 0: the long-term radius, both edges dashed, named in a legend.
  const longTermSeries = longTerm
    ? [
        { name: LONG_TERM_RADIUS_NAME, type: 'line', showSymbol: false, data: longTerm, lineStyle: { color: LONG_TERM_COLOUR, width: 2, type: 'dashed' }, itemStyle: { color: LONG_TERM_COLOUR } },
        {
          name: `${LONG_TERM_RADIUS_NAME} (lower edge)`,
          type: 'line',
          showSymbol: false,
          data: longTerm.map(([distance, radius]) => [distance, -radius]),
          lineStyle: { color: LONG_TERM_COLOUR, width: 2, type: 'dashed' },
          tooltip: { show: false },
        },
      ]
    : [];
  return {
    grid: { left: 64, right: 76, top: longTerm ? 40 : 24, bottom: 44 },
    ...(longTerm && {
      legend: { top: 0, selectedMode: false, data: ['Beam radius', LONG_TERM_RADIUS_NAME], textStyle: { color: text.text } },
    }),
    tooltip: {
      trigger: 'axis',
      valueFormatter: (value: number) => `${Math.abs(value).toPrecision(3)} ${y.unit}`,
    },
    xAxis: { type: 'value', name: `distance from the transmitter (${x.unit})`, nameLocation: 'middle', nameGap: 28, max: Number((rangeM * x.factor).toPrecision(6)), ...axisStyle(mode) },
    // symmetric, and tall enough for the receive aperture even when the beam is smaller
    yAxis: { type: 'value', name: `1/e² radius (${y.unit})`, min: -niceLimit(largest * y.factor), max: niceLimit(largest * y.factor), ...axisStyle(mode) },
    series: [
      {
        name: 'Beam radius',
        type: 'line',
        showSymbol: false,
        data: upper,
        lineStyle: { color: beamPalette.beam, width: 2 },
        itemStyle: { color: beamPalette.beam },
        areaStyle: { color: beamPalette.beam, opacity: 0.18, origin: 0 },
        markLine: { symbol: 'none', silent: true, data: markLines },
      },
      {
        name: 'Beam radius (lower edge)',
        type: 'line',
        showSymbol: false,
        data: lower,
        lineStyle: { color: beamPalette.beam, width: 2, type: 'solid' },
        areaStyle: { color: beamPalette.beam, opacity: 0.18, origin: 0 },
        tooltip: { show: false },
      },
      ...longTermSeries,
    ],
  };
}

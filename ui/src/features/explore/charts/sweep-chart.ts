// ECharts option of a one-input sweep: the link margin against the swept input, the failing band
// shaded, the required margin and the design's own value marked. Pure (no ECharts import).
import type { ChartOption } from '@/components/charts/echart';
import { CHART_TEXT, axisStyle, type ChartMode } from '@/components/charts/chart-theme';
import { marginWord, round, type ChartData } from '@/components/charts/chart-format';
import { beamPalette } from '@/lib/theme';
import { EXPLORE_FIELDS } from '@/features/explore/explore-fields';
import type { LineSweepResult, SweepAxis } from '@/features/explore/sweep-compute';

export interface SweepChartInput {
  axis: SweepAxis;
  result: LineSweepResult;
  /** the design's own value of the swept input [SI] */
  designValueSi: number;
  requiredMarginDb: number;
}

/** The plotted points: the input in its display unit against the margin in dB (refused points left out). */
export function sweepPoints({ axis, result }: Pick<SweepChartInput, 'axis' | 'result'>): [number, number][] {
  const factor = EXPLORE_FIELDS[axis.field].factor;
  const points: [number, number][] = [];
  result.xSi.forEach((x, index) => {
    const margin = result.marginDb[index]!;
    if (Number.isFinite(margin)) points.push([x / factor, margin]);
  });
  return points;
}

export function sweepData(input: Pick<SweepChartInput, 'axis' | 'result'>): ChartData {
  const field = EXPLORE_FIELDS[input.axis.field];
  return {
    columns: [`${field.label} (${field.unit})`, 'Link margin (dB)', 'Verdict'],
    rows: sweepPoints(input).map(([x, margin]) => [x, margin, marginWord(margin)]),
  };
}

export function sweepOption(input: SweepChartInput, mode: ChartMode): ChartOption {
  const field = EXPLORE_FIELDS[input.axis.field];
  const text = CHART_TEXT[mode];
  const points = sweepPoints(input);
  const margins = points.map(([, margin]) => margin);
  const axisMin = Math.floor(Math.min(-5, ...margins) / 5) * 5;
  const axisMax = Math.ceil(Math.max(input.requiredMarginDb + 5, ...margins) / 5) * 5;
  return {
    grid: { left: 56, right: 24, top: 24, bottom: 48 },
    tooltip: {
      trigger: 'axis',
      valueFormatter: (value: unknown) => (typeof value === 'number' ? `${round(value)} dB` : String(value)),
    },
    xAxis: {
      type: input.axis.spacing === 'log' ? 'log' : 'value',
      name: `${field.label} (${field.unit})`,
      nameLocation: 'middle',
      nameGap: 30,
      min: input.axis.fromSi / field.factor,
      max: input.axis.toSi / field.factor,
      ...axisStyle(mode),
    },
    yAxis: { type: 'value', name: 'Margin (dB)', min: axisMin, max: axisMax, ...axisStyle(mode) },
    series: [
      {
        type: 'line',
        name: 'Link margin',
        showSymbol: false,
        data: points,
        lineStyle: { color: beamPalette.beam, width: 2 },
        itemStyle: { color: beamPalette.beam },
        markLine: {
          symbol: 'none',
          silent: true,
          data: [
            { yAxis: 0, lineStyle: { color: beamPalette.poor, type: 'solid' }, label: { formatter: '0 dB', position: 'insideEndTop', color: text.text } },
            {
              yAxis: input.requiredMarginDb,
              lineStyle: { color: text.muted, type: 'dashed' },
              label: { formatter: `required ${round(input.requiredMarginDb, 0)} dB`, position: 'insideEndTop', color: text.muted },
            },
            {
              xAxis: input.designValueSi / field.factor,
              lineStyle: { color: beamPalette.aperture, type: 'solid', width: 2 },
              label: { formatter: 'this design', color: text.text },
            },
          ],
        },
        markArea: { silent: true, itemStyle: { color: beamPalette.poor, opacity: 0.08 }, data: [[{ yAxis: axisMin }, { yAxis: 0 }]] },
      },
    ],
  };
}

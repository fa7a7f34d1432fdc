// ECharts options of the margin against path length and against visibility. Pure, like every chart
// option here; the tables under the charts are built from the same points.
import type { RangeSweep, VisibilitySweep } from '@beamwright/link-core';
import type { ChartOption } from '@/components/charts/echart';
import { CHART_TEXT, axisStyle, type ChartMode } from '@/components/charts/chart-theme';
import { beamPalette } from '@/lib/theme';
import { distanceAxis, marginWord, round, type ChartData } from '@/components/charts/chart-format';

/** Margin against path length as plotted: path length in km (or m), margin in dB. */
export function marginVsRangePoints(sweep: RangeSweep) {
  const last = sweep.rangeM[sweep.rangeM.length - 1] ?? 0;
  const x = distanceAxis(last);
  const points = sweep.rangeM.map((range, index) => [range * x.factor, sweep.linkMarginDb[index]!] as [number, number]);
  return { last, x, points };
}

export function marginVsRangeData(sweep: RangeSweep): ChartData {
  const { x, points } = marginVsRangePoints(sweep);
  return { columns: [`Path length (${x.unit})`, 'Link margin (dB)', 'Verdict'], rows: points.map(([range, margin]) => [range, margin, marginWord(margin)]) };
}

export function marginVsRangeOption(sweep: RangeSweep, designRangeM: number, requiredMarginDb: number, mode: ChartMode): ChartOption {
  const { x, points } = marginVsRangePoints(sweep);
  const last = sweep.rangeM[sweep.rangeM.length - 1] ?? designRangeM;
  const text = CHART_TEXT[mode];
  // The axis always shows the failing region below 0 dB, shaded from the bottom of the axis.
  const lowest = Math.min(...sweep.linkMarginDb);
  const axisMin = Math.min(-5, Math.floor(lowest / 5) * 5);
  return {
    grid: { left: 56, right: 24, top: 24, bottom: 44 },
    tooltip: {
      trigger: 'axis',
      formatter: (params: Array<{ data: [number, number] }>) => {
        const [distance, margin] = params[0]?.data ?? [0, 0];
        return `${distance.toPrecision(4)} ${x.unit}: margin ${round(margin)} dB`;
      },
    },
    xAxis: { type: 'value', name: `path length (${x.unit})`, nameLocation: 'middle', nameGap: 28, min: 0, max: Number((last * x.factor).toPrecision(6)), ...axisStyle(mode) },
    yAxis: { type: 'value', name: 'margin (dB)', min: axisMin, ...axisStyle(mode) },
    series: [
      {
        name: 'Link margin',
        type: 'line',
        showSymbol: false,
        data: points,
        lineStyle: { color: '#0d7586', width: 2 },
        markLine: {
          symbol: 'none',
          silent: true,
          data: [
            { yAxis: 0, lineStyle: { color: beamPalette.poor, type: 'solid' }, label: { formatter: 'fails below 0 dB', position: 'insideEndBottom', color: beamPalette.poor } },
            {
              yAxis: requiredMarginDb,
              lineStyle: { color: text.muted, type: 'dashed' },
              label: { formatter: `required ${round(requiredMarginDb, 0)} dB`, position: 'insideEndTop', color: text.muted },
            },
            { xAxis: designRangeM * x.factor, lineStyle: { color: beamPalette.beam, type: 'solid', width: 2 }, label: { formatter: 'this design', color: text.text } },
          ],
        },
        markArea: { silent: true, itemStyle: { color: beamPalette.poor, opacity: 0.08 }, data: [[{ yAxis: axisMin }, { yAxis: 0 }]] },
      },
    ],
  };
}

/** Margin against visibility as plotted: visibility in km, margin in dB. */
export function marginVsVisibilityPoints(sweep: VisibilitySweep): [number, number][] {
  return sweep.visibilityM.map((visibility, index) => [visibility / 1000, sweep.linkMarginDb[index]!]);
}

export function marginVsVisibilityData(sweep: VisibilitySweep, bands: readonly { label: string; fromM: number; toM: number }[] = []): ChartData {
  const bandOf = (visibilityKm: number) =>
    bands.find((candidate) => visibilityKm * 1000 >= candidate.fromM && visibilityKm * 1000 < candidate.toM)?.label ?? '—';
  return {
    columns: ['Visibility (km)', 'Weather (visibility code)', 'Link margin (dB)', 'Verdict'],
    rows: marginVsVisibilityPoints(sweep).map(([visibilityKm, margin]) => [visibilityKm, bandOf(visibilityKm), margin, marginWord(margin)]),
  };
}

export function marginVsVisibilityOption(
  sweep: VisibilitySweep,
  designVisibilityM: number,
  mode: ChartMode,
  bands: readonly { label: string; fromM: number; toM: number }[] = [],
): ChartOption {
  const text = CHART_TEXT[mode];
  // Dense fog takes the margin to hundreds of dB below zero; show the part where decisions are made.
  const lowest = Math.min(...sweep.linkMarginDb);
  const highest = Math.max(...sweep.linkMarginDb);
  const floor = Math.max(Math.floor(lowest / 10) * 10, Math.min(-30, Math.floor((highest - 60) / 10) * 10));
  return {
    grid: { left: 56, right: 24, top: 24, bottom: 44 },
    tooltip: {
      trigger: 'axis',
      formatter: (params: Array<{ data: [number, number] }>) => {
        const [visibilityKm, margin] = params[0]?.data ?? [0, 0];
        const band = bands.find((candidate) => visibilityKm * 1000 >= candidate.fromM && visibilityKm * 1000 < candidate.toM);
        return `visibility ${visibilityKm.toPrecision(3)} km${band ? ` (${band.label.toLowerCase()})` : ''}: margin ${round(margin)} dB`;
      },
    },
    xAxis: { type: 'log', name: 'visibility (km, log scale)', nameLocation: 'middle', nameGap: 28, ...axisStyle(mode), axisLabel: { color: text.text, formatter: (value: number) => String(value) } },
    yAxis: { type: 'value', name: 'margin (dB)', min: floor, ...axisStyle(mode) },
    series: [
      {
        name: 'Link margin',
        type: 'line',
        showSymbol: false,
        clip: true,
        data: marginVsVisibilityPoints(sweep),
        lineStyle: { color: '#0d7586', width: 2 },
        markLine: {
          symbol: 'none',
          silent: true,
          data: [
            { yAxis: 0, lineStyle: { color: beamPalette.poor, type: 'solid' }, label: { formatter: 'fails below 0 dB', position: 'insideEndBottom', color: beamPalette.poor } },
            { xAxis: designVisibilityM / 1000, lineStyle: { color: beamPalette.beam, width: 2 }, label: { formatter: 'design visibility', color: text.text } },
          ],
        },
        markArea: {
          silent: true,
          itemStyle: { color: text.split, opacity: 0.5 },
          label: { color: text.muted, fontSize: 10, position: 'insideBottom' },
          data: bands
            .filter((_, index) => index % 2 === 0)
            .map((band) => [{ xAxis: Math.max(band.fromM, 50) / 1000, name: band.label }, { xAxis: Math.min(band.toM, 50_000) / 1000 }]),
        },
      },
    ],
  };
}

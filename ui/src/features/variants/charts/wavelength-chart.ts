// ECharts option of the wavelength comparison: the link margin against visibility, one line per
// wavelength, the same optics at each. Pure (no ECharts import).
import type { WavelengthComparison } from '@beamwright/link-core';
import type { ChartOption } from '@/components/charts/echart';
import { CHART_TEXT, axisStyle, type ChartMode } from '@/components/charts/chart-theme';
import { round, type ChartData } from '@/components/charts/chart-format';
import { beamPalette } from '@/lib/theme';

// told apart by dash as well as hue (Okabe–Ito colours, readable with colour-vision deficiencies)
const LINE_STYLES = [
  { color: '#0072b2', type: 'solid' },
  { color: '#d55e00', type: 'dashed' },
  { color: '#009e73', type: 'dotted' },
  { color: '#cc79a7', type: [8, 3, 2, 3] },
  { color: '#e69f00', type: 'solid' },
  { color: '#56b4e9', type: 'dashed' },
  { color: '#000000', type: 'dotted' },
  { color: '#f0e442', type: [8, 3, 2, 3] },
] as const;

export const wavelengthName = (wavelengthM: number) => `${Number((wavelengthM * 1e9).toPrecision(4))} nm`;

export function wavelengthChartData(comparison: WavelengthComparison): ChartData {
  return {
    columns: ['Visibility (km)', ...comparison.rows.map((row) => `Margin at ${wavelengthName(row.wavelengthM)} (dB)`)],
    rows: comparison.visibilityM.map((visibility, index) => [visibility / 1000, ...comparison.rows.map((row) => row.marginVsVisibilityDb[index]!)]),
  };
}

export function wavelengthChartOption(comparison: WavelengthComparison, designVisibilityM: number, requiredMarginDb: number, mode: ChartMode): ChartOption {
  const text = CHART_TEXT[mode];
  const all = comparison.rows.flatMap((row) => row.marginVsVisibilityDb).filter(Number.isFinite);
  const axisMin = Math.max(Math.floor(Math.min(-10, ...all) / 10) * 10, -60);
  const axisMax = Math.ceil(Math.max(requiredMarginDb + 5, ...all) / 5) * 5;
  return {
    grid: { left: 56, right: 24, top: 40, bottom: 48 },
    legend: { top: 0, textStyle: { color: text.text } },
    tooltip: { trigger: 'axis', valueFormatter: (value: unknown) => (typeof value === 'number' ? `${round(value)} dB` : String(value)) },
    xAxis: { type: 'log', name: 'Visibility (km)', nameLocation: 'middle', nameGap: 30, min: comparison.visibilityM[0]! / 1000, max: comparison.visibilityM[comparison.visibilityM.length - 1]! / 1000, ...axisStyle(mode), axisLabel: { ...axisStyle(mode).axisLabel, formatter: (value: number) => String(Number(value.toPrecision(3))) } },
    yAxis: { type: 'value', name: 'Margin (dB)', min: axisMin, max: axisMax, ...axisStyle(mode) },
    series: comparison.rows.map((row, index) => {
      const style = LINE_STYLES[index % LINE_STYLES.length]!;
      return {
        type: 'line',
        name: wavelengthName(row.wavelengthM),
        showSymbol: false,
        data: comparison.visibilityM.map((visibility, sample) => [visibility / 1000, row.marginVsVisibilityDb[sample]!]),
        lineStyle: { color: style.color, type: style.type, width: 2 },
        itemStyle: { color: style.color },
        ...(index === 0
          ? {
              markLine: {
                symbol: 'none',
                silent: true,
                data: [
                  { yAxis: 0, lineStyle: { color: beamPalette.poor, type: 'solid' }, label: { formatter: '0 dB', position: 'insideEndTop', color: text.text } },
                  { yAxis: requiredMarginDb, lineStyle: { color: text.muted, type: 'dashed' }, label: { formatter: `required ${round(requiredMarginDb, 0)} dB`, position: 'insideEndTop', color: text.muted } },
                  { xAxis: designVisibilityM / 1000, lineStyle: { color: text.muted, type: 'solid' }, label: { formatter: 'design visibility', color: text.text } },
                ],
              },
            }
          : {}),
      };
    }),
  };
}

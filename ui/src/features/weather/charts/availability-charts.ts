// ECharts options of the availability page: availability per calendar month, availability against
// path length with the 99 / 99.9 / 99.99 % lines, and the distribution of the margin. Pure (no
// echarts import); each chart's table is built from the same points.
import type { AvailabilityAtRange, RangeForAvailability } from '@beamwright/link-core';
import type { RevisionAvailability } from '@beamwright/link-core/contracts';
import type { ChartOption } from '@/components/charts/echart';
import type { ChartTable } from '@/components/charts/chart-values-table';
import { CHART_TEXT, axisStyle, type ChartMode } from '@/components/charts/chart-theme';
import { beamPalette } from '@/lib/theme';

export const MONTH_NAMES = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

/** A percentage as the charts print it: enough decimals to tell 99.9 % from 99.99 %. */
export function percentText(fraction: number | null, digits = 3): string {
  if (fraction === null || !Number.isFinite(fraction)) return '—';
  return `${(fraction * 100).toFixed(digits)} %`;
}

/** A lower axis limit in % that keeps the lowest value and the targets in view: 90, 99, 99.9 … */
function availabilityAxisMinPercent(lowestFraction: number): number {
  const lowest = lowestFraction * 100;
  for (const candidate of [99.9, 99, 95, 90, 75, 50]) if (lowest >= candidate + (100 - candidate) * 0.05) return candidate;
  return 0;
}

export type MonthRow = RevisionAvailability['months'][number];

export function monthlyAvailabilityTable(months: readonly MonthRow[]): ChartTable {
  return {
    columns: ['Month', 'Availability (%)', 'Hours with records', 'Hours down'],
    rows: months.map((month) => [MONTH_NAMES[month.month - 1]!, month.availability * 100, month.coveredHours, month.unavailableHours]),
  };
}

export function monthlyAvailabilityOption(months: readonly MonthRow[], mode: ChartMode): ChartOption {
  const text = CHART_TEXT[mode];
  const lowest = Math.min(1, ...months.map((month) => month.availability));
  return {
    grid: { left: 64, right: 16, top: 24, bottom: 40 },
    tooltip: {
      trigger: 'axis',
      formatter: (params: Array<{ dataIndex: number }>) => {
        const month = months[params[0]?.dataIndex ?? 0];
        return month ? `${MONTH_NAMES[month.month - 1]}: ${percentText(month.availability)} (${month.unavailableHours.toFixed(0)} h down of ${month.coveredHours.toFixed(0)} h)` : '';
      },
    },
    xAxis: { type: 'category', data: months.map((month) => MONTH_NAMES[month.month - 1]!.slice(0, 3)), ...axisStyle(mode) },
    yAxis: { type: 'value', name: 'availability (%)', min: availabilityAxisMinPercent(lowest), max: 100, ...axisStyle(mode) },
    series: [
      {
        name: 'Availability',
        type: 'bar',
        data: months.map((month) => Number((month.availability * 100).toFixed(4))),
        itemStyle: { color: beamPalette.aperture },
        label: { show: months.length <= 12, position: 'top', color: text.text, fontSize: 10, formatter: (params: { value: number }) => params.value.toFixed(2) },
      },
    ],
  };
}

/** Availability against path length, in km and %. */
export function availabilityRangeTable(points: readonly AvailabilityAtRange[] | readonly { rangeM: number; availability: number | null }[]): ChartTable {
  return {
    columns: ['Path length (km)', 'Availability (%)'],
    rows: points.map((point) => [point.rangeM / 1000, point.availability === null || !Number.isFinite(point.availability) ? '—' : point.availability * 100]),
  };
}

export function availabilityRangeOption(
  points: readonly { rangeM: number; availability: number | null }[],
  ranges: readonly Pick<RangeForAvailability, 'targetAvailability' | 'rangeM'>[],
  designRangeM: number,
  mode: ChartMode,
): ChartOption {
  const text = CHART_TEXT[mode];
  const usable = points.filter((point) => point.availability !== null && Number.isFinite(point.availability));
  const lowest = Math.min(...usable.map((point) => point.availability!), 1);
  const axisMin = Math.max(availabilityAxisMinPercent(Math.max(lowest, 0.9)), 90);
  return {
    grid: { left: 64, right: 24, top: 24, bottom: 44 },
    tooltip: {
      trigger: 'axis',
      formatter: (params: Array<{ data: [number, number] }>) => {
        const [km, percent] = params[0]?.data ?? [0, 0];
        return `${km.toPrecision(3)} km: ${percent.toFixed(3)} %`;
      },
    },
    xAxis: { type: 'value', name: 'path length (km)', nameLocation: 'middle', nameGap: 28, min: 0, ...axisStyle(mode) },
    yAxis: { type: 'value', name: 'availability (%)', min: axisMin, max: 100, ...axisStyle(mode) },
    series: [
      {
        name: 'Availability',
        type: 'line',
        showSymbol: false,
        // below the axis the curve is clipped; the table keeps every value
        data: usable.map((point) => [point.rangeM / 1000, Math.max(axisMin, point.availability! * 100)]),
        lineStyle: { color: '#0d7586', width: 2 },
        markLine: {
          symbol: 'none',
          silent: true,
          data: [
            ...ranges
              .filter((range) => range.targetAvailability * 100 >= axisMin)
              .map((range) => ({
                yAxis: range.targetAvailability * 100,
                lineStyle: { color: text.muted, type: 'dashed' as const },
                label: { formatter: `${percentText(range.targetAvailability, range.targetAvailability >= 0.9999 ? 2 : 1)}`, position: 'insideStartTop' as const, color: text.muted },
              })),
            { xAxis: designRangeM / 1000, lineStyle: { color: beamPalette.beam, type: 'solid' as const, width: 2 }, label: { formatter: 'this design', color: text.text } },
          ],
        },
      },
    ],
  };
}

export type MarginDistribution = RevisionAvailability['marginDistribution'];

const marginEdge = (value: number) => (value < 0 ? `\u2212${Math.abs(value)}` : String(value));

export function marginDistributionTable(distribution: MarginDistribution, coveredHours: number): ChartTable {
  const share = (hours: number) => (coveredHours > 0 ? (100 * hours) / coveredHours : 0);
  return {
    columns: ['Margin from (dB)', 'to (dB)', 'Hours', 'Share of the hours (%)'],
    rows: [
      ...(distribution.belowHours > 0 ? [[`below ${marginEdge(distribution.floorDb)}`, marginEdge(distribution.floorDb), distribution.belowHours, share(distribution.belowHours)]] : []),
      ...distribution.bins.map((bin) => [bin.lowerDb, bin.upperDb, bin.hours, share(bin.hours)]),
    ],
  };
}

export function marginDistributionOption(distribution: MarginDistribution, requiredMarginDb: number, mode: ChartMode): ChartOption {
  const labels = [
    ...(distribution.belowHours > 0 ? [`< ${marginEdge(distribution.floorDb)}`] : []),
    ...distribution.bins.map((bin) => marginEdge(bin.lowerDb)),
  ];
  const hours = [...(distribution.belowHours > 0 ? [distribution.belowHours] : []), ...distribution.bins.map((bin) => bin.hours)];
  const failing = [...(distribution.belowHours > 0 ? [true] : []), ...distribution.bins.map((bin) => bin.upperDb <= requiredMarginDb)];
  return {
    grid: { left: 64, right: 16, top: 24, bottom: 48 },
    tooltip: { trigger: 'axis', formatter: (params: Array<{ dataIndex: number; value: number }>) => `from ${labels[params[0]?.dataIndex ?? 0]} dB: ${(params[0]?.value ?? 0).toFixed(0)} h` },
    xAxis: { type: 'category', name: 'margin after the weather (dB, bin start)', nameLocation: 'middle', nameGap: 30, data: labels, ...axisStyle(mode) },
    // hours span from a few to tens of thousands: a log axis shows the fog hours beside the clear ones
    yAxis: { type: 'log', name: 'hours', min: 1, ...axisStyle(mode) },
    series: [
      {
        name: 'Hours',
        type: 'bar',
        data: hours.map((value, index) => ({ value: Math.max(value, 0.5), itemStyle: { color: failing[index] ? beamPalette.poor : beamPalette.good } })),
      },
    ],
  };
}

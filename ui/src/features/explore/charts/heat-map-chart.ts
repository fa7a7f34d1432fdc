// ECharts option of a two-input heat map: one cell per budget, coloured by the link margin, with the
// 0 dB and the required-margin contours drawn over it and the design's own point marked. Pure (no
// ECharts import); the contours come from d3-contour's marching squares on the same grid.
import { contours } from 'd3-contour';
import type { ChartOption } from '@/components/charts/echart';
import { CHART_TEXT, axisStyle, type ChartMode } from '@/components/charts/chart-theme';
import { marginWord, round, type ChartData } from '@/components/charts/chart-format';
import { EXPLORE_FIELDS } from '@/features/explore/explore-fields';
import type { GridSweepResult, SweepAxis } from '@/features/explore/sweep-compute';

export interface HeatMapInput {
  xAxis: SweepAxis;
  yAxis: SweepAxis;
  result: GridSweepResult;
  /** the design's own point [SI] */
  designXSi: number;
  designYSi: number;
  requiredMarginDb: number;
}

// Diverging about 0 dB: reds where the link fails, blues where it closes. Red–blue (not red–green)
// stays readable with the common colour-vision deficiencies, and the contours carry the levels too.
export const HEAT_MAP_COLOURS = ['#b2182b', '#ef8a62', '#fddbc7', '#d1e5f0', '#67a9cf', '#2166ac'];

/** Half-width of the colour scale [dB]: the scale is symmetric about 0, so 0 dB is always its middle. */
export function colourSpanDb(lowDb: number, highDb: number): number {
  const widest = Math.max(Math.abs(lowDb), Math.abs(highDb));
  return Math.min(Math.max(Math.ceil(widest / 5) * 5, 10), 30);
}

const axisLabel = (value: number) => String(Number(value.toPrecision(3)));

/** A sample's display value at a fractional index along an axis (log axes interpolate in log). */
function valueAtIndex(axis: SweepAxis, index: number): number {
  const factor = EXPLORE_FIELDS[axis.field].factor;
  const last = Math.max(axis.points - 1, 1);
  const t = Math.min(Math.max(index / last, 0), 1);
  const si = axis.spacing === 'log' ? axis.fromSi * (axis.toSi / axis.fromSi) ** t : axis.fromSi + (axis.toSi - axis.fromSi) * t;
  return si / factor;
}

/**
 * The level lines of the margin at `levelsDb`, as polylines in display units. d3-contour closes each
 * ring along the grid's edge; those edge stretches are not level lines, so the rings are cut there.
 */
export function marginContours(input: Pick<HeatMapInput, 'xAxis' | 'yAxis' | 'result'>, levelsDb: number[]): { levelDb: number; lines: [number, number][][] }[] {
  const nx = input.result.xSi.length;
  const ny = input.result.ySi.length;
  if (nx < 2 || ny < 2) return levelsDb.map((levelDb) => ({ levelDb, lines: [] }));
  // a refused point counts as far below any level, so it sits outside every contour
  const values = Array.from(input.result.marginDb, (margin) => (Number.isFinite(margin) ? margin : -1e9));
  const generator = contours().size([nx, ny]).thresholds(levelsDb);
  return generator(values).map((multi) => {
    const lines: [number, number][][] = [];
    for (const polygon of multi.coordinates) {
      for (const ring of polygon) {
        let current: [number, number][] = [];
        for (const [cx, cy] of ring) {
          // grid space: sample i sits at i + 0.5; the padding ring runs along 0 and n
          const onEdge = cx < 0.5 - 1e-9 || cx > nx - 0.5 + 1e-9 || cy < 0.5 - 1e-9 || cy > ny - 0.5 + 1e-9;
          if (onEdge) {
            if (current.length > 1) lines.push(current);
            current = [];
            continue;
          }
          current.push([valueAtIndex(input.xAxis, cx - 0.5), valueAtIndex(input.yAxis, cy - 0.5)]);
        }
        if (current.length > 1) lines.push(current);
      }
    }
    return { levelDb: multi.value, lines };
  });
}

/** Cell edges halfway between samples (geometric halfway on a log axis), in display units. */
function cellEdges(axis: SweepAxis, valuesSi: Float64Array): number[] {
  const factor = EXPLORE_FIELDS[axis.field].factor;
  const v = Array.from(valuesSi, (x) => x / factor);
  const mid = (a: number, b: number) => (axis.spacing === 'log' ? Math.sqrt(a * b) : (a + b) / 2);
  const edges: number[] = [];
  for (let i = 0; i <= v.length; i++) {
    if (i === 0) edges.push(v.length > 1 ? (axis.spacing === 'log' ? v[0]! ** 2 / mid(v[0]!, v[1]!) : v[0]! - (mid(v[0]!, v[1]!) - v[0]!)) : v[0]!);
    else if (i === v.length) edges.push(v.length > 1 ? (axis.spacing === 'log' ? v[i - 1]! ** 2 / mid(v[i - 2]!, v[i - 1]!) : v[i - 1]! + (v[i - 1]! - mid(v[i - 2]!, v[i - 1]!))) : v[i - 1]!);
    else edges.push(mid(v[i - 1]!, v[i]!));
  }
  return edges;
}

export function heatMapData(input: Pick<HeatMapInput, 'xAxis' | 'yAxis' | 'result'>): ChartData {
  const xField = EXPLORE_FIELDS[input.xAxis.field];
  const yField = EXPLORE_FIELDS[input.yAxis.field];
  const nx = input.result.xSi.length;
  const rows: (number | string)[][] = [];
  input.result.ySi.forEach((y, iy) => {
    input.result.xSi.forEach((x, ix) => {
      const margin = input.result.marginDb[iy * nx + ix]!;
      rows.push([y / yField.factor, x / xField.factor, margin, Number.isFinite(margin) ? marginWord(margin) : 'not computed']);
    });
  });
  return { columns: [`${yField.label} (${yField.unit})`, `${xField.label} (${xField.unit})`, 'Link margin (dB)', 'Verdict'], rows };
}

export function heatMapOption(input: HeatMapInput, mode: ChartMode): ChartOption {
  const text = CHART_TEXT[mode];
  const xField = EXPLORE_FIELDS[input.xAxis.field];
  const yField = EXPLORE_FIELDS[input.yAxis.field];
  const nx = input.result.xSi.length;
  const xEdges = cellEdges(input.xAxis, input.result.xSi);
  const yEdges = cellEdges(input.yAxis, input.result.ySi);
  const cells: number[][] = [];
  let low = Infinity;
  let high = -Infinity;
  input.result.ySi.forEach((_, iy) => {
    input.result.xSi.forEach((__, ix) => {
      const margin = input.result.marginDb[iy * nx + ix]!;
      if (!Number.isFinite(margin)) return;
      low = Math.min(low, margin);
      high = Math.max(high, margin);
      cells.push([xEdges[ix]!, xEdges[ix + 1]!, yEdges[iy]!, yEdges[iy + 1]!, margin]);
    });
  });
  if (!Number.isFinite(low)) [low, high] = [-10, 10];
  const span = colourSpanDb(low, high);
  // the colour takes the margin clamped to the scale; the tooltip and the table give the true value
  for (const cell of cells) cell.splice(4, 1, Math.min(Math.max(cell[4]!, -span), span), cell[4]!);
  const levels = [0, input.requiredMarginDb];
  const contourSeries = marginContours(input, levels).flatMap(({ levelDb, lines }) =>
    lines.map((line, index) => ({
      type: 'line',
      name: levelDb === 0 ? '0 dB (the link fails beyond)' : `required ${round(input.requiredMarginDb, 0)} dB`,
      id: `contour-${levelDb}-${index}`,
      data: line,
      showSymbol: false,
      silent: true,
      z: 5,
      lineStyle: { color: '#111827', width: levelDb === 0 ? 2.5 : 2, type: levelDb === 0 ? 'solid' : 'dashed' },
      itemStyle: { color: '#111827' },
    })),
  );
  return {
    grid: { left: 64, right: 96, top: 24, bottom: 52 },
    tooltip: { trigger: 'item' },
    xAxis: {
      type: input.xAxis.spacing === 'log' ? 'log' : 'value',
      name: `${xField.label} (${xField.unit})`,
      nameLocation: 'middle',
      nameGap: 30,
      min: input.xAxis.fromSi / xField.factor,
      max: input.xAxis.toSi / xField.factor,
      ...axisStyle(mode),
      axisLabel: { ...axisStyle(mode).axisLabel, formatter: axisLabel },
      splitLine: { show: false },
    },
    yAxis: {
      type: input.yAxis.spacing === 'log' ? 'log' : 'value',
      name: `${yField.label} (${yField.unit})`,
      nameLocation: 'middle',
      nameGap: 48,
      min: input.yAxis.fromSi / yField.factor,
      max: input.yAxis.toSi / yField.factor,
      ...axisStyle(mode),
      axisLabel: { ...axisStyle(mode).axisLabel, formatter: axisLabel },
      splitLine: { show: false },
    },
    visualMap: {
      type: 'continuous',
      dimension: 4,
      seriesIndex: 0,
      min: -span,
      max: span,
      calculable: false,
      orient: 'vertical',
      right: 8,
      top: 'middle',
      text: ['margin dB', ''],
      textStyle: { color: text.text },
      inRange: { color: HEAT_MAP_COLOURS },
    },
    series: [
      {
        type: 'custom',
        name: 'Link margin',
        data: cells,
        encode: { x: [0, 1], y: [2, 3], tooltip: 5 },
        // the edge cells reach half a step past the first and last samples: cut at the axes
        clip: true,
        renderItem: (_params: unknown, api: { value: (dimension: number) => number; coord: (point: number[]) => number[]; visual: (key: string) => string }) => {
          const [x0, y0] = api.coord([api.value(0), api.value(2)]) as [number, number];
          const [x1, y1] = api.coord([api.value(1), api.value(3)]) as [number, number];
          return { type: 'rect', shape: { x: Math.min(x0, x1), y: Math.min(y0, y1), width: Math.abs(x1 - x0) + 0.5, height: Math.abs(y1 - y0) + 0.5 }, style: { fill: api.visual('color') } };
        },
        tooltip: { valueFormatter: (value: unknown) => (typeof value === 'number' ? `${round(value)} dB` : String(value)) },
      },
      ...contourSeries,
      {
        type: 'scatter',
        name: 'This design',
        data: [[input.designXSi / xField.factor, input.designYSi / yField.factor]],
        symbol: 'diamond',
        symbolSize: 14,
        z: 6,
        itemStyle: { color: '#fde047', borderColor: '#111827', borderWidth: 1.5 },
        label: { show: true, formatter: 'this design', position: 'top', color: text.text, fontWeight: 'bold' },
      },
    ],
  };
}

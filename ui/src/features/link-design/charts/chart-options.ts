// ECharts options of the planner's charts, built from link-core's results. Pure functions (no
// ECharts import), so they are cheap to test and the chart library stays in its lazy chunk.
import type { BeamEnvelope, LinkBudget, RangeSweep, VisibilitySweep } from '@beamwright/link-core';
import type { ChartOption } from '@/components/charts/echart';
import { CHART_TEXT, axisStyle, type ChartMode } from '@/components/charts/chart-theme';
import { beamPalette } from '@/lib/theme';
import { MARGIN_VERDICT_TEXT, marginVerdict } from '@/components/ui/margin-verdict';

const SHORT_TERM_NAMES: Record<string, string> = {
  transmitPower: 'Tx power',
  transmitOptics: 'Tx optics',
  geometricSpread: 'Spread',
  turbulenceBeamSpread: 'Beam spread',
  atmosphericAttenuation: 'Weather',
  pointingLoss: 'Pointing',
  receiveOptics: 'Rx optics',
  scintillationFade: 'Fade',
  systemAllowance: 'Allowance',
};

function round(value: number, digits = 2): string {
  const text = value.toFixed(digits);
  return Number(text) === 0 ? (0).toFixed(digits) : text.replace('-', '\u2212');
}

// The tables give each margin the same worded verdict as the headline and the links list.
const marginWord = (marginDb: number): string => MARGIN_VERDICT_TEXT[marginVerdict(marginDb)];

interface WaterfallStep {
  name: string;
  low: number;
  high: number;
  /** 'gain' for a budget term the physics makes positive (an offset or spread onto an obscured aperture) */
  kind: 'level' | 'loss' | 'gain' | 'margin-good' | 'margin-poor';
  detail: string;
}

/** The steps of the waterfall, in dBm: from the transmit power down to the received power, then the reserves, then the margin above the sensitivity. */
export function waterfallSteps(budget: LinkBudget): { steps: WaterfallStep[]; sensitivityDbm: number } {
  const steps: WaterfallStep[] = [];
  const byKey = new Map(budget.terms.map((term) => [term.key, term]));
  const sensitivityDbm = -(byKey.get('receiverSensitivity')?.valueDb ?? 0);
  let level = byKey.get('transmitPower')?.valueDb ?? 0;
  steps.push({ name: SHORT_TERM_NAMES.transmitPower!, low: Number.NaN, high: level, kind: 'level', detail: `${round(level)} dBm` });
  const loss = (key: string) => {
    const term = byKey.get(key as never);
    if (!term) return;
    const next = level + term.valueDb;
    steps.push({ name: SHORT_TERM_NAMES[key] ?? term.label, low: Math.min(level, next), high: Math.max(level, next), kind: term.valueDb > 0 ? 'gain' : 'loss', detail: `${term.label}: ${term.valueDb > 0 ? '+' : ''}${round(term.valueDb)} dB${term.valueDb > 0 ? ' (a gain)' : ''}` });
    level = next;
  };
  for (const key of ['transmitOptics', 'geometricSpread', 'turbulenceBeamSpread', 'atmosphericAttenuation', 'pointingLoss', 'receiveOptics']) loss(key);
  steps.push({ name: 'Received', low: Number.NaN, high: level, kind: 'level', detail: `Mean received power: ${round(level)} dBm` });
  for (const key of ['scintillationFade', 'systemAllowance']) loss(key);
  const good = level >= sensitivityDbm;
  steps.push({
    name: 'Margin',
    low: Math.min(level, sensitivityDbm),
    high: Math.max(level, sensitivityDbm),
    kind: good ? 'margin-good' : 'margin-poor',
    detail: `Link margin: ${round(budget.linkMarginDb)} dB above the sensitivity (${round(sensitivityDbm)} dBm)`,
  });
  return { steps, sensitivityDbm };
}

export function waterfallOption(budget: LinkBudget, mode: ChartMode): ChartOption {
  const { steps, sensitivityDbm } = waterfallSteps(budget);
  const levels = steps.flatMap((step) => [step.low, step.high]).filter(Number.isFinite);
  // Round limits and a round step, so the dBm labels read 20, 0, −20 … despite the offset axis.
  const floor = Math.floor((Math.min(...levels, sensitivityDbm) - 5) / 10) * 10;
  const ceiling = Math.ceil((Math.max(...levels, sensitivityDbm) + 3) / 10) * 10;
  const step = ceiling - floor > 80 ? 20 : 10;
  const colourOf = (kind: WaterfallStep['kind']) =>
    kind === 'level' ? '#0d7586' : kind === 'loss' ? beamPalette.loss : kind === 'gain' || kind === 'margin-good' ? beamPalette.good : beamPalette.poor;
  const text = CHART_TEXT[mode];
  return {
    grid: { left: 56, right: 84, top: 24, bottom: 56 },
    tooltip: {
      trigger: 'axis',
      axisPointer: { type: 'shadow' },
      formatter: (params: Array<{ dataIndex: number }>) => steps[params[0]?.dataIndex ?? 0]?.detail ?? '',
    },
    xAxis: {
      type: 'category',
      data: steps.map((step) => step.name),
      ...axisStyle(mode),
      axisLabel: { color: text.text, interval: 0, fontSize: 11, rotate: 35 },
    },
    yAxis: {
      type: 'value',
      name: 'dBm',
      min: 0,
      max: ceiling - floor,
      interval: step,
      ...axisStyle(mode),
      axisLabel: { color: text.text, formatter: (value: number) => round(value + floor, 0) },
    },
    series: [
      {
        name: 'base',
        type: 'bar',
        stack: 'waterfall',
        silent: true,
        itemStyle: { color: 'transparent' },
        data: steps.map((step) => (Number.isFinite(step.low) ? step.low - floor : 0)),
      },
      {
        name: 'step',
        type: 'bar',
        stack: 'waterfall',
        barMaxWidth: 42,
        data: steps.map((step) => ({
          value: Number.isFinite(step.low) ? step.high - step.low : step.high - floor,
          itemStyle: {
            color: colourOf(step.kind),
            // the margin bar is hatched by a border so the verdict does not rest on colour alone
            borderColor: step.kind.startsWith('margin') ? text.text : undefined,
            borderWidth: step.kind.startsWith('margin') ? 1 : 0,
            borderType: step.kind === 'margin-poor' ? 'dashed' : 'solid',
          },
        })),
        markLine: {
          symbol: 'none',
          silent: true,
          lineStyle: { color: text.muted, type: 'dashed' },
          label: { formatter: `sensitivity\n${round(sensitivityDbm, 1)} dBm`, position: 'end', color: text.muted },
          data: [{ yAxis: sensitivityDbm - floor }],
        },
      },
    ],
  };
}

/** A round axis limit a little above `value` (1, 2 or 5 times a power of ten). */
function niceLimit(value: number): number {
  const target = value * 1.1;
  const power = 10 ** Math.floor(Math.log10(target));
  const step = [1, 2, 2.5, 5, 10].find((factor) => factor * power >= target) ?? 10;
  return step * power;
}

function distanceAxis(maxM: number): { unit: 'km' | 'm'; factor: number } {
  return maxM >= 1000 ? { unit: 'km', factor: 1e-3 } : { unit: 'm', factor: 1 };
}

/**
 * The values a chart plots, in the units of its axes, and the same values as a table: the table
 * under each chart is built from these very points, so it always says what the chart shows.
 */
export interface ChartData {
  columns: string[];
  /** one row per plotted sample; a column is a number (in the unit its heading names) or a word */
  rows: (number | string)[][];
}

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

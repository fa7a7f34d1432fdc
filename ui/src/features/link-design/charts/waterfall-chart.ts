// ECharts option of the budget waterfall: from the transmit power down to the received power, then
// the reserves, then the margin. Pure (no ECharts import), so the chart library stays in its lazy chunk.
import type { LinkBudget } from '@beamwright/link-core';
import type { ChartOption } from '@/components/charts/echart';
import { CHART_TEXT, axisStyle, type ChartMode } from '@/components/charts/chart-theme';
import { beamPalette } from '@/lib/theme';
import { round } from '@/components/charts/chart-format';

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

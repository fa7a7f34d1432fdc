// Colours and axis styling of the charts in each app theme. Kept apart from echart.tsx so that the
// option builders of the features can use them without pulling ECharts into their chunk.
export type ChartMode = 'light' | 'dark';

export const CHART_TEXT = {
  light: { text: '#334155', muted: '#64748b', axis: '#94a3b8', split: '#e2e8f0', surface: '#ffffff' },
  dark: { text: '#cbd5e1', muted: '#94a3b8', axis: '#64748b', split: '#334155', surface: '#1f2937' },
} as const;

export function axisStyle(mode: ChartMode) {
  const colours = CHART_TEXT[mode];
  return {
    axisLine: { lineStyle: { color: colours.axis } },
    axisTick: { lineStyle: { color: colours.axis } },
    axisLabel: { color: colours.text },
    splitLine: { lineStyle: { color: colours.split } },
    nameTextStyle: { color: colours.muted },
  };
}

// The one ECharts wrapper of the app. Only the chart types and components listed in use([...])
// are bundled (tree-shaken echarts/core), and this module is only ever loaded lazily
// (see lazy-echart.tsx), so the charts never weigh on the first screen.
import ReactEChartsCore from 'echarts-for-react/esm/core';
import * as echarts from 'echarts/core';
import { BarChart, CustomChart, LineChart, ScatterChart } from 'echarts/charts';
import {
  AriaComponent,
  GridComponent,
  LegendComponent,
  MarkAreaComponent,
  MarkLineComponent,
  MarkPointComponent,
  TooltipComponent,
  VisualMapContinuousComponent,
} from 'echarts/components';
import { SVGRenderer } from 'echarts/renderers';
import type { EChartsCoreOption } from 'echarts/core';
import { useThemeMode } from '@/lib/theme';
import { CHART_TEXT } from '@/components/charts/chart-theme';

echarts.use([
  LineChart,
  BarChart,
  // the heat maps: one rect per budget (custom), the design's point (scatter), the colour scale
  CustomChart,
  ScatterChart,
  VisualMapContinuousComponent,
  GridComponent,
  TooltipComponent,
  LegendComponent,
  MarkLineComponent,
  MarkAreaComponent,
  MarkPointComponent,
  AriaComponent,
  SVGRenderer,
]);

export type ChartOption = EChartsCoreOption;

export interface EChartProps {
  option: ChartOption;
  /** what the chart shows, read by screen readers */
  ariaLabel: string;
  height?: number;
  testId?: string;
}

export function EChart({ option, ariaLabel, height = 280, testId }: EChartProps) {
  const [mode] = useThemeMode();
  const colours = CHART_TEXT[mode];
  const themed: ChartOption = {
    backgroundColor: 'transparent',
    textStyle: { color: colours.text, fontFamily: "'Open Sans', 'Segoe UI', sans-serif" },
    aria: { enabled: true, label: { description: ariaLabel } },
    animationDuration: 250,
    animationDurationUpdate: 150,
    ...option,
  };
  return (
    <div role="img" aria-label={ariaLabel} data-testid={testId}>
      <ReactEChartsCore
        echarts={echarts}
        option={themed}
        notMerge
        lazyUpdate
        opts={{ renderer: 'svg' }}
        style={{ height, width: '100%' }}
      />
    </div>
  );
}

export default EChart;

import { lazy, Suspense } from 'react';
import { Skeleton, SkeletonItem } from '@fluentui/react-components';
import type { EChartProps } from '@/components/charts/echart';

// ECharts is fetched the first time a chart is on screen, not with the first page.
const EChart = lazy(() => import('@/components/charts/echart'));

export function LazyEChart(props: EChartProps) {
  const height = props.height ?? 280;
  return (
    <Suspense
      fallback={
        <Skeleton aria-label="Loading chart">
          <SkeletonItem style={{ height }} />
        </Skeleton>
      }
    >
      <EChart {...props} />
    </Suspense>
  );
}

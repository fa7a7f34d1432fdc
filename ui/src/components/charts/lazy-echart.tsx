import { lazy, Suspense } from 'react';
import { Caption1, Skeleton, SkeletonItem } from '@fluentui/react-components';
import { ErrorBoundary } from '@/components/errors/error-boundary';
import type { EChartProps } from '@/components/charts/echart';

// ECharts is fetched the first time a chart is on screen, not with the first page.
const EChart = lazy(() => import('@/components/charts/echart'));

export function LazyEChart(props: EChartProps) {
  const height = props.height ?? 280;
  return (
    <ErrorBoundary fallback={(error) => <Caption1 role="alert">The chart could not be drawn: {error.message}</Caption1>}>
      <Suspense
        fallback={
          <Skeleton aria-label="Loading chart">
            <SkeletonItem style={{ height }} />
          </Skeleton>
        }
      >
        <EChart {...props} />
      </Suspense>
    </ErrorBoundary>
  );
}

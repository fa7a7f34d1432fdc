// A chart in its card: title, the chart, a caption, and the plotted values as a table for screen
// readers and for anyone who wants the numbers (every chart of the app has one).
import type { ReactNode } from 'react';
import { Caption1, Subtitle2, makeStyles, tokens } from '@fluentui/react-components';
import type { ChartData } from '@/components/charts/chart-format';
import { ChartValuesTable } from '@/components/charts/chart-values-table';

const useStyles = makeStyles({
  card: {
    backgroundColor: tokens.colorNeutralBackground1,
    border: `1px solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusLarge,
    padding: tokens.spacingHorizontalM,
    display: 'grid',
    rowGap: tokens.spacingVerticalXS,
    minWidth: 0,
  },
  caption: { color: tokens.colorNeutralForeground3 },
});

export function ChartCard({ title, caption, children, data, testId }: { title: string; caption: ReactNode; children: ReactNode; data?: ChartData; testId?: string }) {
  const styles = useStyles();
  return (
    <section className={styles.card} aria-label={title}>
      <Subtitle2 as="h3">{title}</Subtitle2>
      {children}
      <Caption1 className={styles.caption}>{caption}</Caption1>
      {data && testId && <ChartValuesTable title={title} table={data} testId={testId} />}
    </section>
  );
}

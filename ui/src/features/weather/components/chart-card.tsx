import type { ReactNode } from 'react';
import { Caption1, Subtitle2, makeStyles, tokens } from '@fluentui/react-components';
import { ChartValuesTable, type ChartTable } from '@/components/charts/chart-values-table';

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

/** A chart with its title, a caption that says how to read it, and its values as a table. */
export function ChartCard({ title, caption, table, testId, children }: { title: string; caption: ReactNode; table: ChartTable; testId: string; children: ReactNode }) {
  const styles = useStyles();
  return (
    <section className={styles.card} aria-label={title}>
      <Subtitle2 as="h3">{title}</Subtitle2>
      {children}
      <Caption1 className={styles.caption}>{caption}</Caption1>
      <ChartValuesTable title={title} table={table} testId={testId} />
    </section>
  );
}

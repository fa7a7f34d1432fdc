// A chart in its card: title, the chart, a caption, and the plotted values as a table for screen
// readers and for anyone who wants the numbers (every chart of the app has one).
import type { ReactNode } from 'react';
import {
  Accordion,
  AccordionHeader,
  AccordionItem,
  AccordionPanel,
  Caption1,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import type { ChartData } from '@/components/charts/chart-format';

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
  tableScroll: { maxHeight: '320px', overflowY: 'auto', overflowX: 'auto' },
  number: { fontVariantNumeric: 'tabular-nums', textAlign: 'end' },
});

/** A plotted number as the table shows it: four significant figures, a true minus sign. */
export function formatPlottedValue(value: number | string): string {
  if (typeof value === 'string') return value;
  if (!Number.isFinite(value)) return '—';
  const text = String(Number(value.toPrecision(4)));
  return text.startsWith('-') ? `\u2212${text.slice(1)}` : text;
}

/** The chart's values as a table, for screen readers and for anyone who wants the numbers. */
function ChartValuesTable({ title, data, testId }: { title: string; data: ChartData; testId: string }) {
  const styles = useStyles();
  return (
    <Accordion collapsible>
      <AccordionItem value="table">
        <AccordionHeader size="small">Show the values as a table ({data.rows.length} rows)</AccordionHeader>
        <AccordionPanel>
          {/* focusable so that keyboard users can scroll it (WCAG 2.1.1) */}
          <div className={styles.tableScroll} tabIndex={0} role="region" aria-label={`${title}: values`}>
            <Table size="extra-small" aria-label={`${title}: the values plotted`} data-testid={`${testId}-table`}>
              <TableHeader>
                <TableRow>
                  {data.columns.map((column) => (
                    <TableHeaderCell key={column}>{column}</TableHeaderCell>
                  ))}
                </TableRow>
              </TableHeader>
              <TableBody>
                {data.rows.map((row, rowIndex) => (
                  <TableRow key={rowIndex}>
                    {row.map((cell, cellIndex) => (
                      <TableCell key={cellIndex} className={typeof cell === 'number' ? styles.number : undefined}>
                        {formatPlottedValue(cell)}
                      </TableCell>
                    ))}
                  </TableRow>
                ))}
              </TableBody>
            </Table>
          </div>
        </AccordionPanel>
      </AccordionItem>
    </Accordion>
  );
}

export function ChartCard({ title, caption, children, data, testId }: { title: string; caption: ReactNode; children: ReactNode; data?: ChartData; testId?: string }) {
  const styles = useStyles();
  return (
    <section className={styles.card} aria-label={title}>
      <Subtitle2 as="h3">{title}</Subtitle2>
      {children}
      <Caption1 className={styles.caption}>{caption}</Caption1>
      {data && testId && <ChartValuesTable title={title} data={data} testId={testId} />}
    </section>
  );
}

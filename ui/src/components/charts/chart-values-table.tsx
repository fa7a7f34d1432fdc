import {
  Accordion,
  AccordionHeader,
  AccordionItem,
  AccordionPanel,
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

/** The points a chart plots, as a table: column headings with their units, one row per point. */
export type ChartTable = ChartData;

const useStyles = makeStyles({
  scroll: { maxHeight: '320px', overflowY: 'auto', overflowX: 'auto' },
  number: { fontVariantNumeric: 'tabular-nums', textAlign: 'end' },
  panel: { paddingInline: tokens.spacingHorizontalXS },
});

/** Four significant figures and a true minus sign, as the charts' tooltips read. */
export function formatTableNumber(value: number | string): string {
  if (typeof value === 'string') return value;
  if (!Number.isFinite(value)) return '—';
  const text = String(Number(value.toPrecision(4)));
  return text.startsWith('-') ? `\u2212${text.slice(1)}` : text;
}

/**
 * "Show the values as a table" under a chart: the very points the chart plots, for screen readers
 * and for anyone who wants the numbers. The scrolling region is focusable, so a keyboard scrolls it.
 */
export function ChartValuesTable({ title, table, testId }: { title: string; table: ChartTable; testId: string }) {
  const styles = useStyles();
  return (
    <Accordion collapsible>
      <AccordionItem value="table">
        <AccordionHeader size="small">Show the values as a table ({table.rows.length} rows)</AccordionHeader>
        <AccordionPanel className={styles.panel}>
          <div className={styles.scroll} tabIndex={0} role="region" aria-label={`${title}: values`}>
            <Table size="extra-small" aria-label={`${title}: the values plotted`} data-testid={`${testId}-table`}>
              <TableHeader>
                <TableRow>
                  {table.columns.map((column) => (
                    <TableHeaderCell key={column}>{column}</TableHeaderCell>
                  ))}
                </TableRow>
              </TableHeader>
              <TableBody>
                {table.rows.map((row, rowIndex) => (
                  <TableRow key={rowIndex}>
                    {row.map((cell, cellIndex) => (
                      <TableCell key={cellIndex} className={typeof cell === 'number' ? styles.number : undefined}>
                        {formatTableNumber(cell)}
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

import { Fragment } from 'react';
import { Table, TableBody, TableCell, TableHeader, TableHeaderCell, TableRow, makeStyles, mergeClasses, shorthands, tokens } from '@fluentui/react-components';
import { StarFilled } from '@fluentui/react-icons';
import type { ComparisonRow } from '@/features/variants/variant-comparison';

const useStyles = makeStyles({
  scroll: { overflowX: 'auto', maxWidth: '100%' },
  number: { textAlign: 'end', fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap' },
  group: { backgroundColor: tokens.colorNeutralBackground3, fontWeight: tokens.fontWeightSemibold, textTransform: 'capitalize' },
  // a value that differs from the design's: a tinted cell and an underline, so it is not colour alone
  differs: { backgroundColor: tokens.colorPaletteYellowBackground1, textDecorationLine: 'underline', textDecorationStyle: 'dotted', textUnderlineOffset: '3px' },
  best: { fontWeight: tokens.fontWeightBold },
  star: { color: tokens.colorPaletteMarigoldForeground3, verticalAlign: 'text-bottom', marginInlineEnd: tokens.spacingHorizontalXXS },
  hidden: {
    position: 'absolute',
    width: '1px',
    height: '1px',
    ...shorthands.overflow('hidden'),
    clipPath: 'inset(50%)',
    whiteSpace: 'nowrap',
  },
  label: { minWidth: '180px' },
});

/** A compared value as the table shows it: three decimals at most, a true minus sign. */
export function formatComparedValue(value: number | string | null, unit: string): string {
  if (value === null) return '—';
  if (typeof value === 'string') return value;
  if (!Number.isFinite(value)) return '—';
  const digits = unit === 'dB' || unit === 'dBm' ? 2 : Math.abs(value) >= 100 ? 0 : Math.abs(value) >= 10 ? 1 : 3;
  const text = value.toFixed(digits);
  return (Number(text) === 0 ? (0).toFixed(digits) : text).replace('-', '\u2212');
}

export function ComparisonTable({ columns, rows, testId }: { columns: string[]; rows: ComparisonRow[]; testId: string }) {
  const styles = useStyles();
  const groups = [...new Set(rows.map((row) => row.group))];
  return (
    <div className={styles.scroll} tabIndex={0} role="region" aria-label="Comparison of the design and its alternatives">
      <Table size="small" aria-label="The design and its alternatives, side by side" data-testid={testId}>
        <TableHeader>
          <TableRow>
            <TableHeaderCell className={styles.label}>Quantity</TableHeaderCell>
            {columns.map((column, index) => (
              <TableHeaderCell key={index} className={styles.number}>
                {column}
              </TableHeaderCell>
            ))}
          </TableRow>
        </TableHeader>
        <TableBody>
          {groups.map((group) => (
            <Fragment key={group}>
              <TableRow>
                <TableCell className={styles.group} colSpan={columns.length + 1}>
                  {group}
                </TableCell>
              </TableRow>
              {rows
                .filter((row) => row.group === group)
                .map((row) => (
                  <TableRow key={row.key} data-row={row.key}>
                    <TableCell className={styles.label}>
                      {row.label}
                      {row.unit ? ` (${row.unit})` : ''}
                    </TableCell>
                    {row.values.map((value, index) => {
                      const best = row.best.includes(index);
                      const differs = row.differs[index];
                      return (
                        <TableCell key={index} className={mergeClasses(styles.number, differs && styles.differs, best && styles.best)} data-best={best || undefined} data-differs={differs || undefined}>
                          {best && <StarFilled className={styles.star} aria-hidden />}
                          {formatComparedValue(value, row.unit)}
                          {(best || differs) && <span className={styles.hidden}>{[best ? 'best' : '', differs ? 'differs from the design' : ''].filter(Boolean).join(', ')}</span>}
                        </TableCell>
                      );
                    })}
                  </TableRow>
                ))}
            </Fragment>
          ))}
        </TableBody>
      </Table>
    </div>
  );
}

import { Caption1, Table, TableBody, TableCell, TableHeader, TableHeaderCell, TableRow, makeStyles } from '@fluentui/react-components';
import type { WeatherRowError } from '@beamwright/link-core/contracts';

const useStyles = makeStyles({ scroll: { maxHeight: '280px', overflowY: 'auto' } });

/** The rows of a file that could not be read: line, column and reason (the count covers any not listed). */
export function RowErrorsTable({ rowErrors, rowErrorCount, caption }: { rowErrors: readonly WeatherRowError[]; rowErrorCount: number; caption: string }) {
  const styles = useStyles();
  return (
    <div>
      <div className={styles.scroll} tabIndex={0} role="region" aria-label={caption}>
        <Table size="small" aria-label={caption} data-testid="row-errors">
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Line</TableHeaderCell>
              <TableHeaderCell>Column</TableHeaderCell>
              <TableHeaderCell>Problem</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {rowErrors.map((error, index) => (
              <TableRow key={`${error.line}-${error.column}-${index}`}>
                <TableCell>{error.line}</TableCell>
                <TableCell>{error.column ?? 'the whole row'}</TableCell>
                <TableCell>{error.message}</TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      </div>
      {rowErrorCount > rowErrors.length && (
        <Caption1>
          The first {rowErrors.length.toLocaleString('en-GB')} of {rowErrorCount.toLocaleString('en-GB')} problems are listed.
        </Caption1>
      )}
    </div>
  );
}

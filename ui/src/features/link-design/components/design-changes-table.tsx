import { Caption1, Table, TableBody, TableCell, TableHeader, TableHeaderCell, TableRow } from '@fluentui/react-components';
import type { DesignChange } from '@/features/link-design/design-diff';

/** Field-by-field changes between two versions of a design. */
export function DesignChangesTable({
  changes,
  beforeLabel,
  afterLabel,
  testId,
}: {
  changes: DesignChange[];
  beforeLabel: string;
  afterLabel: string;
  testId?: string;
}) {
  if (changes.length === 0) return <Caption1 data-testid={testId}>No design field differs.</Caption1>;
  return (
    <Table size="extra-small" aria-label="Changed fields" data-testid={testId}>
      <TableHeader>
        <TableRow>
          <TableHeaderCell>Field</TableHeaderCell>
          <TableHeaderCell>{beforeLabel}</TableHeaderCell>
          <TableHeaderCell>{afterLabel}</TableHeaderCell>
        </TableRow>
      </TableHeader>
      <TableBody>
        {changes.map((change) => (
          <TableRow key={change.path} data-path={change.path}>
            <TableCell>{change.label}</TableCell>
            <TableCell>{change.before}</TableCell>
            <TableCell>{change.after}</TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}

import { Table, TableBody, TableCell, TableHeader, TableHeaderCell, TableRow } from '@fluentui/react-components';
import type { RangeForAvailability } from '@beamwright/link-core';
import { formatDistance } from '@/lib/format';
import { percentText } from '@/features/weather/charts/availability-charts';

type Range = Pick<RangeForAvailability, 'targetAvailability' | 'status' | 'rangeM' | 'visibilityM'>;

function rangeText(range: Range): string {
  if (range.status === 'not-achievable') return 'not reached even at 50 m';
  if (range.status === 'beyond-search-limit') return 'beyond 50 km';
  return `up to ${formatDistance(range.rangeM)}`;
}

/** The longest paths at which the design still reaches 99 %, 99.9 % and 99.99 % with the chosen data. */
export function RangeTargets({ ranges, visibilityLabel, testId }: { ranges: readonly Range[]; visibilityLabel: string; testId: string }) {
  return (
    <Table size="small" aria-label="Path length for each availability" data-testid={testId}>
      <TableHeader>
        <TableRow>
          <TableHeaderCell>Availability</TableHeaderCell>
          <TableHeaderCell>Path length</TableHeaderCell>
          <TableHeaderCell>{visibilityLabel}</TableHeaderCell>
        </TableRow>
      </TableHeader>
      <TableBody>
        {ranges.map((range) => (
          <TableRow key={range.targetAvailability} data-target={range.targetAvailability}>
            <TableCell>{percentText(range.targetAvailability, range.targetAvailability >= 0.9999 ? 2 : 1)}</TableCell>
            <TableCell>{rangeText(range)}</TableCell>
            <TableCell>{formatDistance(range.visibilityM)}</TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}

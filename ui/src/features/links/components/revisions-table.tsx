import { Table, TableBody, TableCell, TableHeader, TableHeaderCell, TableRow, Text, makeStyles, tokens } from '@fluentui/react-components';
import { CheckmarkStarburstRegular } from '@fluentui/react-icons';
import type { RevisionSummary } from '@beamwright/link-core/contracts';
import { MarginBadge } from '@/components/ui/margin-verdict';
import { formatDateTime, formatDistance, formatWavelength } from '@/lib/format';

const useStyles = makeStyles({
  number: { fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap' },
  note: { whiteSpace: 'pre-wrap', maxWidth: '420px' },
  muted: { color: tokens.colorNeutralForeground3 },
  approval: { display: 'inline-flex', columnGap: tokens.spacingHorizontalXS, alignItems: 'flex-start' },
  approvalIcon: { color: tokens.colorPaletteGreenForeground1, fontSize: '18px', flexShrink: 0, marginTop: '2px' },
});

/** Every revision of a link, newest first. */
export function RevisionsTable({ revisions }: { revisions: RevisionSummary[] }) {
  const styles = useStyles();
  const newestFirst = [...revisions].sort((a, b) => b.revision - a.revision);
  return (
    <Table size="small" aria-label="Revisions" data-testid="revisions-table">
      <TableHeader>
        <TableRow>
          <TableHeaderCell style={{ width: 72 }}>Rev.</TableHeaderCell>
          <TableHeaderCell>Note</TableHeaderCell>
          <TableHeaderCell>Saved</TableHeaderCell>
          <TableHeaderCell>Link margin</TableHeaderCell>
          <TableHeaderCell>Path</TableHeaderCell>
          <TableHeaderCell>Approval</TableHeaderCell>
        </TableRow>
      </TableHeader>
      <TableBody>
        {newestFirst.map((revision) => (
          <TableRow key={revision.revision} data-revision={revision.revision}>
            <TableCell className={styles.number}>
              <Text weight="semibold">{revision.revision}</Text>
            </TableCell>
            <TableCell className={styles.note}>{revision.note || <span className={styles.muted}>(no note)</span>}</TableCell>
            <TableCell>
              {revision.author.displayName}
              <br />
              <span className={styles.muted}>{formatDateTime(revision.createdAt)}</span>
            </TableCell>
            <TableCell>
              <MarginBadge linkMarginDb={revision.linkMarginDb} size="small" />
            </TableCell>
            <TableCell className={styles.number}>
              {formatDistance(revision.rangeM)} · {formatWavelength(revision.wavelengthM)}
            </TableCell>
            <TableCell>
              {revision.approval ? (
                <span className={styles.approval}>
                  <CheckmarkStarburstRegular className={styles.approvalIcon} aria-label="Approved" />
                  <span>
                    {revision.approval.by.displayName}
                    <br />
                    <span className={styles.muted}>{formatDateTime(revision.approval.at)}</span>
                  </span>
                </span>
              ) : (
                <span className={styles.muted}>—</span>
              )}
            </TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}

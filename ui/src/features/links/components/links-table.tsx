import { useMemo } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import {
  DataGrid,
  DataGridBody,
  DataGridCell,
  DataGridHeader,
  DataGridHeaderCell,
  DataGridRow,
  Text,
  Tooltip,
  createFocusOutlineStyle,
  createTableColumn,
  makeStyles,
  tokens,
  type SortDirection,
  type TableColumnDefinition,
  type TableColumnId,
} from '@fluentui/react-components';
import { paths } from '@/config/paths';
import { formatDateTime, formatDistance, formatRelativeTime, formatWavelength } from '@/lib/format';
import { MarginBadge } from '@/components/ui/margin-verdict';
import { LinkStatusBadge } from '@/features/links/components/link-status-badge';
import { EngineMarginFlag, LinkFlags } from '@/features/links/components/link-flags';
import type { LinkSummary } from '@beamwright/link-core/contracts';
import type { LinkSortField } from '@/features/links/api/get-links';

const useStyles = makeStyles({
  // A plain link, the cell's only focus stop; at least 24 × 24 CSS px to click or tap (WCAG 2.2 target size).
  name: {
    display: 'inline-flex',
    // Fluent draws the focus ring as an ::after box around a positioned element
    position: 'relative',
    alignItems: 'center',
    alignSelf: 'flex-start',
    minHeight: '28px',
    minWidth: '24px',
    fontWeight: tokens.fontWeightSemibold,
    color: tokens.colorBrandForegroundLink,
    textDecorationLine: 'none',
    borderRadius: tokens.borderRadiusSmall,
    ':hover': { color: tokens.colorBrandForegroundLinkHover, textDecorationLine: 'underline' },
    ...createFocusOutlineStyle(),
  },
  sites: { color: tokens.colorNeutralForeground3, fontSize: tokens.fontSizeBase200 },
  nameCell: { display: 'flex', flexDirection: 'column', paddingBlock: tokens.spacingVerticalS },
  status: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalXS, paddingBlock: tokens.spacingVerticalXS },
  numeric: { fontVariantNumeric: 'tabular-nums', justifyContent: 'flex-end', textAlign: 'end' },
});

export interface LinksTableProps {
  links: LinkSummary[];
  sort: { field: LinkSortField; order: 'asc' | 'desc' };
  onSortChange: (sort: { field: LinkSortField; order: 'asc' | 'desc' }) => void;
}

export function LinksTable({ links, sort, onSortChange }: LinksTableProps) {
  const styles = useStyles();

  const columns = useMemo<TableColumnDefinition<LinkSummary>[]>(
    () => [
      createTableColumn<LinkSummary>({
        columnId: 'name',
        compare: (a, b) => a.name.localeCompare(b.name),
        renderHeaderCell: () => 'Link',
        renderCell: (link) => (
          <div className={styles.nameCell}>
            <RouterLink to={paths.app.link.getHref(link.id)} className={styles.name} data-testid="link-name">
              {link.name}
            </RouterLink>
            {(link.siteA || link.siteB) && (
              <span className={styles.sites}>
                {link.siteA?.name ?? '—'} ↔ {link.siteB?.name ?? '—'}
              </span>
            )}
          </div>
        ),
      }),
      createTableColumn<LinkSummary>({
        columnId: 'status',
        compare: (a, b) => a.status.localeCompare(b.status),
        renderHeaderCell: () => 'Status',
        renderCell: (link) => (
          <span className={styles.status}>
            <LinkStatusBadge status={link.status} />
            <LinkFlags link={link} />
            <EngineMarginFlag link={link} />
          </span>
        ),
      }),
      createTableColumn<LinkSummary>({
        columnId: 'linkMarginDb',
        compare: (a, b) => a.linkMarginDb - b.linkMarginDb,
        renderHeaderCell: () => 'Link margin',
        renderCell: (link) => <MarginBadge linkMarginDb={link.linkMarginDb} />,
      }),
      createTableColumn<LinkSummary>({
        columnId: 'rangeM',
        compare: (a, b) => a.rangeM - b.rangeM,
        renderHeaderCell: () => 'Range',
        renderCell: (link) => <span className="numeric">{formatDistance(link.rangeM)}</span>,
      }),
      createTableColumn<LinkSummary>({
        columnId: 'wavelengthM',
        compare: (a, b) => a.wavelengthM - b.wavelengthM,
        renderHeaderCell: () => 'Wavelength',
        renderCell: (link) => <span className="numeric">{formatWavelength(link.wavelengthM)}</span>,
      }),
      createTableColumn<LinkSummary>({
        columnId: 'updatedAt',
        compare: (a, b) => a.updatedAt.localeCompare(b.updatedAt),
        renderHeaderCell: () => 'Last change',
        renderCell: (link) => (
          <Tooltip content={formatDateTime(link.updatedAt)} relationship="description">
            <Text>
              {formatRelativeTime(link.updatedAt)} · rev. {link.revision}
            </Text>
          </Tooltip>
        ),
      }),
    ],
    [styles],
  );

  // Sorting happens on the server (the list is paged); the grid only shows and changes the state.
  const sortState: { sortColumn: TableColumnId; sortDirection: SortDirection } = {
    sortColumn: sort.field,
    sortDirection: sort.order === 'asc' ? 'ascending' : 'descending',
  };

  return (
    <DataGrid
      items={links}
      columns={columns}
      sortable
      sortState={sortState}
      onSortChange={(_, next) =>
        onSortChange({ field: next.sortColumn as LinkSortField, order: next.sortDirection === 'ascending' ? 'asc' : 'desc' })
      }
      getRowId={(link) => link.id}
      aria-label="Links"
      data-testid="links-table"
      columnSizingOptions={{
        name: { minWidth: 240, idealWidth: 320 },
        status: { minWidth: 120, idealWidth: 200 },
        linkMarginDb: { minWidth: 170 },
      }}
      resizableColumns
    >
      <DataGridHeader>
        <DataGridRow>{({ renderHeaderCell }) => <DataGridHeaderCell>{renderHeaderCell()}</DataGridHeaderCell>}</DataGridRow>
      </DataGridHeader>
      <DataGridBody<LinkSummary>>
        {({ item, rowId }) => (
          <DataGridRow<LinkSummary> key={rowId} data-link-id={item.id}>
            {/* The name cell is not a focus stop of its own: arrow keys land on its link directly. */}
            {({ renderCell, columnId }) => <DataGridCell focusMode={columnId === 'name' ? 'none' : 'cell'}>{renderCell(item)}</DataGridCell>}
          </DataGridRow>
        )}
      </DataGridBody>
    </DataGrid>
  );
}

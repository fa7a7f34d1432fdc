import { useState } from 'react';
import {
  Badge,
  Button,
  Caption1,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  MessageBar,
  MessageBarBody,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { DeleteRegular } from '@fluentui/react-icons';
import type { WeatherDataset } from '@beamwright/link-core/contracts';
import { formatDateTime } from '@/lib/format';
import { useDeleteWeatherDataset } from '@/features/weather/api/delete-weather-dataset';

const useStyles = makeStyles({
  scroll: { overflowX: 'auto' },
  muted: { color: tokens.colorNeutralForeground3 },
  name: { display: 'grid', rowGap: tokens.spacingVerticalXXS },
});

const dateOnly = (iso: string | null) => (iso ? iso.slice(0, 10) : '—');

/** The organisation's weather data sets, newest first; engineers and admins may delete one. */
export function WeatherDatasetsTable({ datasets, canDelete }: { datasets: readonly WeatherDataset[]; canDelete: boolean }) {
  const styles = useStyles();
  const [confirming, setConfirming] = useState<WeatherDataset | null>(null);
  const remove = useDeleteWeatherDataset();
  if (datasets.length === 0) return <Caption1>No weather data yet. Upload a site&apos;s visibility history to see how often its links close.</Caption1>;
  return (
    <div className={styles.scroll}>
      <Table aria-label="Weather data sets" data-testid="weather-datasets">
        <TableHeader>
          <TableRow>
            <TableHeaderCell>Data set</TableHeaderCell>
            <TableHeaderCell>Site</TableHeaderCell>
            <TableHeaderCell>Records</TableHeaderCell>
            <TableHeaderCell>Period (UTC)</TableHeaderCell>
            <TableHeaderCell>Visibility</TableHeaderCell>
            {canDelete && <TableHeaderCell>Actions</TableHeaderCell>}
          </TableRow>
        </TableHeader>
        <TableBody>
          {datasets.map((dataset) => (
            <TableRow key={dataset.id} data-dataset-id={dataset.id}>
              <TableCell>
                <div className={styles.name}>
                  <span>
                    {dataset.name}{' '}
                    {dataset.invented && (
                      <Badge appearance="outline" color="warning" size="small">
                        Invented demo data
                      </Badge>
                    )}
                  </span>
                  <Caption1 className={styles.muted}>
                    {dataset.sourceFileName ? `from ${dataset.sourceFileName}, ` : ''}added {formatDateTime(dataset.createdAt)}
                    {dataset.createdBy ? ` by ${dataset.createdBy.displayName}` : ''}
                  </Caption1>
                </div>
              </TableCell>
              <TableCell>{dataset.siteName ?? '—'}</TableCell>
              <TableCell>
                {dataset.recordCount.toLocaleString('en-GB')}
                {dataset.missingVisibilityCount > 0 && <Caption1 className={styles.muted}> ({dataset.missingVisibilityCount.toLocaleString('en-GB')} without a reading)</Caption1>}
              </TableCell>
              <TableCell>
                {dateOnly(dataset.firstObservedAt)} to {dateOnly(dataset.lastObservedAt)}
              </TableCell>
              <TableCell>{dataset.visibilityDefinition === 'mor-5-percent' ? 'MOR (5 %)' : '2 % contrast'}</TableCell>
              {canDelete && (
                <TableCell>
                  <Button icon={<DeleteRegular />} appearance="subtle" aria-label={`Delete ${dataset.name}`} onClick={() => setConfirming(dataset)}>
                    Delete
                  </Button>
                </TableCell>
              )}
            </TableRow>
          ))}
        </TableBody>
      </Table>
      <Dialog open={confirming !== null} onOpenChange={(_, data) => !data.open && setConfirming(null)}>
        <DialogSurface>
          <DialogBody>
            <DialogTitle>Delete “{confirming?.name}”?</DialogTitle>
            <DialogContent>
              Its {confirming?.recordCount.toLocaleString('en-GB')} records go with it, and the availability pages that used it will ask for another data set. This cannot be undone.
              {remove.isError && (
                <MessageBar intent="error">
                  <MessageBarBody>{remove.error.message}</MessageBarBody>
                </MessageBar>
              )}
            </DialogContent>
            <DialogActions>
              <Button onClick={() => setConfirming(null)}>Keep it</Button>
              <Button
                appearance="primary"
                disabled={remove.isPending}
                onClick={() => confirming && remove.mutate(confirming.id, { onSuccess: () => setConfirming(null) })}
              >
                Delete the data set
              </Button>
            </DialogActions>
          </DialogBody>
        </DialogSurface>
      </Dialog>
    </div>
  );
}

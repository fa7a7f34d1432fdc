import type { QueryClient } from '@tanstack/react-query';
import { Body1, Card, Skeleton, SkeletonItem, Subtitle2, Title2, makeStyles, tokens } from '@fluentui/react-components';
import { isAllowed } from '@beamwright/link-core/contracts';
import { useCurrentUser } from '@/lib/auth';
import { ErrorView } from '@/components/errors/route-error';
import { getWeatherDatasetsQueryOptions, useWeatherDatasets } from '@/features/weather/api/get-weather-datasets';
import { WeatherDatasetsTable } from '@/features/weather/components/weather-datasets-table';
import { WeatherImportForm } from '@/features/weather/components/weather-import-form';
import { getSitesQueryOptions, useSites } from '@/features/sites/api/get-sites';

const useStyles = makeStyles({
  page: { display: 'grid', rowGap: tokens.spacingVerticalXL, minWidth: 0 },
  intro: { display: 'grid', rowGap: tokens.spacingVerticalS },
  card: { padding: tokens.spacingHorizontalXL, display: 'grid', rowGap: tokens.spacingVerticalM, minWidth: 0 },
  muted: { color: tokens.colorNeutralForeground3, maxWidth: '80ch' },
});

/** The organisation's weather data sets, and the upload of a new one (engineers and admins). */
export function WeatherDatasetsRoute() {
  const styles = useStyles();
  const role = useCurrentUser().data?.role;
  const datasets = useWeatherDatasets();
  const sites = useSites();
  const canWrite = isAllowed(role, 'weather.write');

  return (
    <div className={styles.page}>
      <div className={styles.intro}>
        <Title2 as="h1">Weather data</Title2>
        <Body1 as="p" className={styles.muted} style={{ margin: 0 }}>
          The visibility history of a site, from a weather service or an airport station, tells how often a link closes: each link&apos;s availability
          page computes it over the hours of a data set. Visibility measured at a station is not the visibility on the rooftops of a path.
        </Body1>
      </div>
      {canWrite && (
        <Card className={styles.card}>
          <Subtitle2 as="h2">Upload a data set</Subtitle2>
          <WeatherImportForm sites={sites.data ?? []} />
        </Card>
      )}
      <Card className={styles.card}>
        <Subtitle2 as="h2">Data sets</Subtitle2>
        {datasets.isPending ? (
          <Skeleton aria-label="Loading the data sets">
            <SkeletonItem style={{ height: 120 }} />
          </Skeleton>
        ) : datasets.isError ? (
          <ErrorView error={datasets.error} />
        ) : (
          <WeatherDatasetsTable datasets={datasets.data} canDelete={canWrite} />
        )}
      </Card>
    </div>
  );
}

export function createLoader(queryClient: QueryClient) {
  return () => {
    void queryClient.prefetchQuery(getWeatherDatasetsQueryOptions());
    void queryClient.prefetchQuery(getSitesQueryOptions());
    return null;
  };
}

export const Component = WeatherDatasetsRoute;

import { Link as RouterLink } from 'react-router-dom';
import type { QueryClient } from '@tanstack/react-query';
import {
  Body1,
  Button,
  Card,
  MessageBar,
  MessageBarBody,
  Skeleton,
  SkeletonItem,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  Title2,
  Title3,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { AddRegular } from '@fluentui/react-icons';
import { formatDegreesMinutesSeconds } from '@beamwright/link-core';
import { isAllowed } from '@beamwright/link-core/contracts';
import { paths } from '@/config/paths';
import { useCurrentUser } from '@/lib/auth';
import { getSitesQueryOptions, useSites } from '@/features/sites/api/get-sites';
import { getSitePlanLinksQueryOptions, useSitePlanLinks } from '@/features/sites/api/get-site-links';
import { SitePlan } from '@/features/sites/components/site-plan';
import { linkTextStyle } from '@/components/ui/link-text-style';

const useStyles = makeStyles({
  header: { display: 'flex', flexWrap: 'wrap', alignItems: 'flex-end', justifyContent: 'space-between', gap: tokens.spacingHorizontalL, marginBottom: tokens.spacingVerticalL },
  subtitle: { color: tokens.colorNeutralForeground3 },
  card: { padding: 0, overflowX: 'auto', marginBottom: tokens.spacingVerticalXXL },
  name: linkTextStyle,
  numeric: { fontVariantNumeric: 'tabular-nums' },
  section: { marginBlock: tokens.spacingVerticalL },
  empty: { padding: tokens.spacingHorizontalL, display: 'block' },
});

const dms = (valueDeg: number, positive: string, negative: string) =>
  `${formatDegreesMinutesSeconds(Math.abs(valueDeg), { secondsDecimals: 1 })} ${valueDeg < 0 ? negative : positive}`;

export function SitesListRoute() {
  const styles = useStyles();
  const role = useCurrentUser().data?.role;
  const sites = useSites();
  const links = useSitePlanLinks();
  const linkCount = (siteId: string) => links.data?.items.filter((link) => link.siteA?.id === siteId || link.siteB?.id === siteId).length;

  return (
    <>
      <div className={styles.header}>
        <div>
          <Title2 as="h1">Sites</Title2>
          <div>
            <Body1 className={styles.subtitle}>The rooftops and masts your links run between, and a plan of where they are.</Body1>
          </div>
        </div>
        {isAllowed(role, 'site.write') && (
          <RouterLink to={paths.app.newSite.getHref()} tabIndex={-1}>
            <Button appearance="primary" icon={<AddRegular />}>
              New site
            </Button>
          </RouterLink>
        )}
      </div>
      {sites.isError && (
        <MessageBar intent="error">
          <MessageBarBody>The sites could not be loaded: {sites.error.message}</MessageBarBody>
        </MessageBar>
      )}
      {sites.isPending && (
        <Skeleton aria-label="Loading the sites">
          <SkeletonItem style={{ height: 160 }} />
        </Skeleton>
      )}
      {sites.data && (
        <Card className={styles.card}>
          <Table aria-label="Sites" data-testid="sites-table">
            <TableHeader>
              <TableRow>
                <TableHeaderCell>Site</TableHeaderCell>
                <TableHeaderCell>Latitude</TableHeaderCell>
                <TableHeaderCell>Longitude</TableHeaderCell>
                <TableHeaderCell>Ground elevation</TableHeaderCell>
                <TableHeaderCell>Mount height</TableHeaderCell>
                <TableHeaderCell>Links</TableHeaderCell>
              </TableRow>
            </TableHeader>
            <TableBody>
              {sites.data.map((site) => (
                <TableRow key={site.id}>
                  <TableCell>
                    <RouterLink to={paths.app.site.getHref(site.id)} className={styles.name} data-testid="site-name">
                      {site.name}
                    </RouterLink>
                  </TableCell>
                  <TableCell className={styles.numeric}>{dms(site.latitudeDeg, 'N', 'S')}</TableCell>
                  <TableCell className={styles.numeric}>{dms(site.longitudeDeg, 'E', 'W')}</TableCell>
                  <TableCell className={styles.numeric}>{site.groundElevationM} m</TableCell>
                  <TableCell className={styles.numeric}>{site.mountHeightM} m</TableCell>
                  <TableCell className={styles.numeric}>{linkCount(site.id) ?? '…'}</TableCell>
                </TableRow>
              ))}
            </TableBody>
          </Table>
          {sites.data.length === 0 && <Body1 className={styles.empty}>No sites yet.</Body1>}
        </Card>
      )}
      <section className={styles.section} aria-labelledby="site-plan-heading">
        <Title3 as="h2" id="site-plan-heading">
          Plan of the sites and links
        </Title3>
        {links.isError && (
          <MessageBar intent="warning">
            <MessageBarBody>The links could not be loaded; the plan shows the sites alone.</MessageBarBody>
          </MessageBar>
        )}
        {sites.data && sites.data.length > 0 && <SitePlan sites={sites.data} links={links.data?.items ?? []} />}
      </section>
    </>
  );
}

export const createLoader = (queryClient: QueryClient) => () => {
  void queryClient.prefetchQuery(getSitesQueryOptions());
  void queryClient.prefetchQuery(getSitePlanLinksQueryOptions());
  return null;
};

export const Component = SitesListRoute;

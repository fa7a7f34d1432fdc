import { useState } from 'react';
import { Link as RouterLink, Navigate, useNavigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import type { QueryClient } from '@tanstack/react-query';
import {
  Body1,
  Button,
  Card,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
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
  Text,
  Title2,
  Title3,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { DeleteRegular } from '@fluentui/react-icons';
import { z } from 'zod';
import { SiteInUseBodySchema, isAllowed, type SiteUserLink } from '@beamwright/link-core/contracts';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { useCurrentUser } from '@/lib/auth';
import { formatDistance } from '@/lib/format';
import { MarginBadge } from '@/components/ui/margin-verdict';
import { getSiteQueryOptions, useSite } from '@/features/sites/api/get-site';
import { getSitesQueryOptions, useSites } from '@/features/sites/api/get-sites';
import { getSiteLinksQueryOptions, useSiteLinks } from '@/features/sites/api/get-site-links';
import { useDeleteSite, useSaveSite } from '@/features/sites/api/save-site';
import { SiteForm } from '@/features/sites/components/site-form';
import { SitePlan } from '@/features/sites/components/site-plan';
import { linkTextStyle } from '@/components/ui/link-text-style';

const useStyles = makeStyles({
  page: { display: 'grid', rowGap: tokens.spacingVerticalXL },
  card: { padding: tokens.spacingHorizontalXXL, display: 'grid', rowGap: tokens.spacingVerticalL, minWidth: 0 },
  header: { display: 'flex', flexWrap: 'wrap', justifyContent: 'space-between', alignItems: 'flex-end', gap: tokens.spacingHorizontalL },
  muted: { color: tokens.colorNeutralForeground3 },
  linkName: linkTextStyle,
  tableWrap: { overflowX: 'auto' },
  refusalList: { marginBlock: tokens.spacingVerticalXS, paddingInlineStart: tokens.spacingHorizontalXL },
});

const SiteIdSchema = z.uuid();

/** The links a refused delete names, or null when the error was something else. */
function readSiteInUse(error: unknown): { message: string; links: SiteUserLink[] } | null {
  if (!isApiError(error, 409)) return null;
  const body = SiteInUseBodySchema.safeParse(error.body);
  return body.success ? { message: body.data.message, links: body.data.links } : null;
}

export function SiteEditorRoute() {
  const styles = useStyles();
  const navigate = useNavigate();
  const { siteId } = useParams();
  const isNew = siteId === undefined;
  const role = useCurrentUser().data?.role;
  const canWrite = isAllowed(role, 'site.write');
  const site = useSite(siteId);
  const sites = useSites();
  const siteLinks = useSiteLinks(siteId);
  const save = useSaveSite(siteId);
  const remove = useDeleteSite();
  const [confirming, setConfirming] = useState(false);
  const [refusal, setRefusal] = useState<{ message: string; links: SiteUserLink[] } | null>(null);
  const [deleteError, setDeleteError] = useState<string | null>(null);

  if (isNew && role && !canWrite) return <Navigate to={paths.app.sites.getHref()} replace />;
  if (!isNew && site.isError) {
    return (
      <MessageBar intent="error">
        <MessageBarBody>{isApiError(site.error, 404) ? 'This site does not exist in your organisation.' : `The site could not be loaded: ${site.error.message}`}</MessageBarBody>
      </MessageBar>
    );
  }
  if (!isNew && !site.data) {
    return (
      <Skeleton aria-label="Loading the site">
        <SkeletonItem size={32} />
      </Skeleton>
    );
  }

  const current = site.data;
  const confirmDelete = () => {
    if (!current) return;
    setDeleteError(null);
    remove.mutate(current.id, {
      onSuccess: () => {
        setConfirming(false);
        navigate(paths.app.sites.getHref());
      },
      onError: (error) => {
        setConfirming(false);
        const inUse = readSiteInUse(error);
        if (inUse) setRefusal(inUse);
        else setDeleteError(error instanceof Error ? error.message : 'The site could not be deleted.');
      },
    });
  };

  return (
    <div className={styles.page}>
      <div className={styles.header}>
        <div>
          <Title2 as="h1">{current ? current.name : 'New site'}</Title2>
          <div>
            <Body1 className={styles.muted}>
              {current ? 'Where a terminal is mounted. Moving it changes the path of every link on it.' : 'Give its coordinates in decimal degrees or in degrees, minutes and seconds.'}
            </Body1>
          </div>
        </div>
        {current && canWrite && (
          <Button icon={<DeleteRegular />} onClick={() => setConfirming(true)} data-testid="delete-site">
            Delete site
          </Button>
        )}
      </div>

      {refusal && (
        <MessageBar intent="warning" data-testid="site-in-use" role="alert">
          <MessageBarBody>
            {refusal.message}
            <ul className={styles.refusalList}>
              {refusal.links.map((link) => (
                <li key={link.id}>
                  <RouterLink to={paths.app.link.getHref(link.id)} className={styles.linkName}>
                    {link.name}
                  </RouterLink>
                </li>
              ))}
            </ul>
          </MessageBarBody>
        </MessageBar>
      )}
      {deleteError && (
        <MessageBar intent="error" role="alert">
          <MessageBarBody>{deleteError}</MessageBarBody>
        </MessageBar>
      )}

      {canWrite ? (
        <Card className={styles.card}>
          <SiteForm
            key={current?.updatedAt ?? 'new'}
            site={current}
            pending={save.isPending}
            onCancel={() => navigate(paths.app.sites.getHref())}
            onSubmit={(input, handlers) =>
              save.mutate(input, {
                onSuccess: (saved) => navigate(isNew ? paths.app.site.getHref(saved.id) : paths.app.sites.getHref()),
                onError: handlers.onError,
              })
            }
          />
        </Card>
      ) : (
        current && (
          <Card className={styles.card}>
            <Text>
              {current.latitudeDeg.toFixed(6)}°, {current.longitudeDeg.toFixed(6)}° · ground {current.groundElevationM} m · mount {current.mountHeightM} m
            </Text>
            {current.notes && <Body1>{current.notes}</Body1>}
          </Card>
        )
      )}

      {current && (
        <section aria-labelledby="site-links-heading">
          <Title3 as="h2" id="site-links-heading">
            Links on this site
          </Title3>
          {siteLinks.isPending && <Body1>Loading the links…</Body1>}
          {siteLinks.data && siteLinks.data.items.length === 0 && <Body1 className={styles.muted}>No link uses this site yet.</Body1>}
          {siteLinks.data && siteLinks.data.items.length > 0 && (
            <div className={styles.tableWrap}>
              <Table size="small" aria-label="Links on this site" data-testid="site-links">
                <TableHeader>
                  <TableRow>
                    <TableHeaderCell>Link</TableHeaderCell>
                    <TableHeaderCell>Other end</TableHeaderCell>
                    <TableHeaderCell>Range</TableHeaderCell>
                    <TableHeaderCell>Margin verdict</TableHeaderCell>
                  </TableRow>
                </TableHeader>
                <TableBody>
                  {siteLinks.data.items.map((link) => {
                    const other = link.siteA?.id === current.id ? link.siteB : link.siteA;
                    return (
                      <TableRow key={link.id}>
                        <TableCell>
                          <RouterLink to={paths.app.link.getHref(link.id)} className={styles.linkName}>
                            {link.name}
                          </RouterLink>
                          {link.archived && <Text className={styles.muted}> (archived)</Text>}
                        </TableCell>
                        <TableCell>{other?.name ?? '—'}</TableCell>
                        <TableCell>{formatDistance(link.rangeM)}</TableCell>
                        <TableCell>
                          <MarginBadge linkMarginDb={link.linkMarginDb} size="small" />
                        </TableCell>
                      </TableRow>
                    );
                  })}
                </TableBody>
              </Table>
            </div>
          )}
        </section>
      )}

      {current && sites.data && (
        <section aria-labelledby="site-plan-heading">
          <Title3 as="h2" id="site-plan-heading">
            Where it is among your sites
          </Title3>
          <SitePlan sites={sites.data} links={(siteLinks.data?.items ?? []).filter((link) => !link.archived)} highlightSiteId={current.id} />
        </section>
      )}

      <Dialog open={confirming} onOpenChange={(_, data) => setConfirming(data.open)}>
        <DialogSurface>
          <DialogBody>
            <DialogTitle>Delete {current?.name}?</DialogTitle>
            <DialogContent>A site that a link uses cannot be deleted; the answer will say which links use it.</DialogContent>
            <DialogActions>
              <Button onClick={() => setConfirming(false)}>Keep the site</Button>
              <Button appearance="primary" onClick={confirmDelete} disabled={remove.isPending} data-testid="confirm-delete-site">
                Delete
              </Button>
            </DialogActions>
          </DialogBody>
        </DialogSurface>
      </Dialog>
    </div>
  );
}

/** Starts the site, the site list and the site's links with the queryOptions the page reads. */
export const createLoader = (queryClient: QueryClient) => ({ params }: LoaderFunctionArgs) => {
  void queryClient.prefetchQuery(getSitesQueryOptions());
  const siteId = SiteIdSchema.safeParse(params.siteId);
  if (siteId.success) {
    void queryClient.prefetchQuery(getSiteQueryOptions(siteId.data));
    void queryClient.prefetchQuery(getSiteLinksQueryOptions(siteId.data));
  }
  return null;
};

export const Component = SiteEditorRoute;

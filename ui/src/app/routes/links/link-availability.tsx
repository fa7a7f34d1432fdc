import { useEffect, useMemo } from 'react';
import { Link as RouterLink, useSearchParams } from 'react-router-dom';
import {
  Body1,
  Button,
  Caption1,
  Card,
  Field,
  Input,
  MessageBar,
  MessageBarBody,
  Select,
  Skeleton,
  SkeletonItem,
  Spinner,
  Subtitle2,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { ArrowLeftRegular } from '@fluentui/react-icons';
import { RevisionAvailabilityQuerySchema } from '@beamwright/link-core/contracts';
import { paths } from '@/config/paths';
import { ErrorView } from '@/components/errors/route-error';
import { useLink } from '@/features/links/api/get-link';
import { useRevisions } from '@/features/links/api/get-revisions';
import { LinkHeader } from '@/features/links/components/link-header';
import { useWeatherDatasets } from '@/features/weather/api/get-weather-datasets';
import { useRevisionAvailability } from '@/features/weather/api/get-revision-availability';
import { useRevisionDesign } from '@/features/weather/api/get-revision-design';
import { AvailabilityResults } from '@/features/weather/components/availability-results';
import { ClimatologyAvailability } from '@/features/weather/components/climatology-availability';
import { linkPageLoader, useLinkIdParam } from '@/app/routes/links/link-route-params';

const useStyles = makeStyles({
  page: { display: 'grid', rowGap: tokens.spacingVerticalXL, minWidth: 0 },
  card: { padding: tokens.spacingHorizontalXL, display: 'grid', rowGap: tokens.spacingVerticalM, minWidth: 0 },
  pickers: { display: 'grid', gridTemplateColumns: 'repeat(auto-fit, minmax(min(220px, 100%), 1fr))', gap: tokens.spacingHorizontalM, alignItems: 'start', maxWidth: '960px' },
  muted: { color: tokens.colorNeutralForeground3, maxWidth: '80ch' },
});

const marginSchema = RevisionAvailabilityQuerySchema.shape.requiredMarginDb;

/**
 * How often a link closes: the availability of one of its revisions over a weather data set of the
 * organisation (the records of a site, read by the api with link-core), and from a cumulative
 * visibility table typed or pasted here. The choices live in the address, so a view can be shared.
 */
export function LinkAvailabilityRoute() {
  const styles = useStyles();
  const linkId = useLinkIdParam();
  const link = useLink(linkId);
  const revisions = useRevisions(linkId);
  const datasets = useWeatherDatasets();
  const [search, setSearch] = useSearchParams();

  const latest = link.data?.revision ?? null;
  const revision = Number(search.get('revision')) || latest;
  const marginText = search.get('margin') ?? '0';
  const margin = marginSchema.safeParse(marginText.trim() === '' ? undefined : marginText);
  const requiredMarginDb = margin.success ? margin.data : 0;

  // the data set of one of the link's own sites first, else the newest
  const ends = useMemo(() => [link.data?.siteA?.id, link.data?.siteB?.id].filter(Boolean), [link.data]);
  const chosen = search.get('dataset');
  const fallback = datasets.data?.find((dataset) => dataset.siteId && ends.includes(dataset.siteId)) ?? datasets.data?.[0];
  const datasetId = datasets.data?.some((dataset) => dataset.id === chosen) ? chosen : (fallback?.id ?? null);
  const dataset = datasets.data?.find((candidate) => candidate.id === datasetId);

  const designs = useRevisionDesign(linkId, revision);
  // one of the revision's variants instead of its design ('' in the address: the design itself)
  const variantText = search.get('variant') ?? '';
  const variant = designs.data?.variants.find((candidate) => String(candidate.index) === variantText) ?? null;
  const availability = useRevisionAvailability(linkId, revision, datasetId, requiredMarginDb, variant?.index ?? null);
  const design = { ...designs, data: designs.data ? (variant?.design ?? designs.data.design) : undefined };

  const setChoice = (key: 'revision' | 'dataset' | 'margin' | 'variant', value: string) =>
    setSearch(
      (current) => {
        const next = new URLSearchParams(current);
        next.set(key, value);
        return next;
      },
      { replace: true },
    );

  useEffect(() => {
    document.title = link.data ? `Availability · ${link.data.name} · Beamwright` : 'Availability · Beamwright';
  }, [link.data]);

  if (link.isPending) {
    return (
      <Skeleton aria-label="Loading the link">
        <SkeletonItem size={40} style={{ width: '40%', marginBottom: 16 }} />
        <SkeletonItem style={{ height: 480 }} />
      </Skeleton>
    );
  }
  if (link.isError) return <ErrorView error={link.error} />;

  return (
    <div className={styles.page}>
      <LinkHeader
        link={link.data}
        section="Availability"
        actions={
          <RouterLink to={paths.app.link.getHref(linkId)} tabIndex={-1}>
            <Button icon={<ArrowLeftRegular />}>Back to the design</Button>
          </RouterLink>
        }
      />
      <Card className={styles.card}>
        <Subtitle2 as="h2">Over a weather data set</Subtitle2>
        <div className={styles.pickers}>
          <Field label="Revision">
            <Select value={String(revision ?? '')} onChange={(_, data) => setChoice('revision', data.value)}>
              {(revisions.data ?? (latest ? [{ revision: latest }] : [])).map((item) => (
                <option key={item.revision} value={item.revision}>
                  Revision {item.revision}
                  {item.revision === latest ? ' (latest)' : ''}
                </option>
              ))}
            </Select>
          </Field>
          {(designs.data?.variants.length ?? 0) > 0 && (
            <Field label="Design" hint="The revision's design or one of its alternatives">
              <Select value={variant ? String(variant.index) : ''} onChange={(_, data) => setChoice('variant', data.value)} data-testid="availability-variant">
                <option value="">Revision {revision}'s design</option>
                {designs.data!.variants.map((item) => (
                  <option key={item.index} value={item.index}>
                    Alternative: {item.name}
                  </option>
                ))}
              </Select>
            </Field>
          )}
          <Field label="Weather data set" hint={dataset?.invented ? 'Invented demo data, not a measurement' : dataset?.siteName ? `Site: ${dataset.siteName}` : undefined}>
            <Select value={datasetId ?? ''} onChange={(_, data) => setChoice('dataset', data.value)} disabled={!datasets.data?.length} data-testid="availability-dataset">
              {(datasets.data ?? []).map((item) => (
                <option key={item.id} value={item.id}>
                  {item.name}
                </option>
              ))}
            </Select>
          </Field>
          <Field
            label="Required margin (dB)"
            hint="Margin that must be left after the visibility loss"
            validationMessage={margin.success ? undefined : `Required margin ${margin.error.issues[0]?.message ?? 'is not valid'}`}
            validationState={margin.success ? 'none' : 'error'}
          >
            <Input value={marginText} inputMode="decimal" onChange={(_, data) => setChoice('margin', data.value)} />
          </Field>
        </div>
        {datasets.data?.length === 0 && (
          <Body1 className={styles.muted}>
            The organisation has no weather data yet: <RouterLink to={paths.app.weatherDatasets.getHref()}>upload a site&apos;s visibility history</RouterLink>, or use a cumulative
            table below.
          </Body1>
        )}
        {availability.isError && <ErrorView error={availability.error} />}
        {availability.isFetching && !availability.data && <Spinner label="Computing the availability over every hour of the data set…" />}
        {availability.data && link.data && (
          <>
            {availability.isPlaceholderData && (
              <MessageBar intent="info">
                <MessageBarBody>Computing for the new choice; the figures below are still the previous ones.</MessageBarBody>
              </MessageBar>
            )}
            <AvailabilityResults availability={availability.data} designRangeM={design.data?.rangeM ?? link.data.design.rangeM} />
          </>
        )}
      </Card>
      <Card className={styles.card}>
        <Subtitle2 as="h2">From a cumulative table</Subtitle2>
        <Caption1 className={styles.muted}>When no records exist: the site&apos;s visibility statistics as P(V &lt; v), for revision {revision}.</Caption1>
        {design.data ? <ClimatologyAvailability key={revision ?? 0} design={design.data} /> : design.isError ? <ErrorView error={design.error} /> : <Spinner size="small" label="Loading the revision" />}
      </Card>
    </div>
  );
}

export const createLoader = linkPageLoader;
export const Component = LinkAvailabilityRoute;

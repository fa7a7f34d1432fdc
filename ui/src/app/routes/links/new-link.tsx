import { useRef } from 'react';
import { Navigate, useNavigate } from 'react-router-dom';
import type { QueryClient } from '@tanstack/react-query';
import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
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
  Spinner,
  Title2,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { CreateLinkRequestSchema, ORGANISATION_DEFAULTS, type DistanceUnit } from '@beamwright/link-core/contracts';
import { parseQuantity } from '@beamwright/link-core/units';
import { paths } from '@/config/paths';
import { policies, useCurrentUser } from '@/lib/auth';
import { labelledMessage, setApiFieldErrors, withFieldMessages, type IssueTarget } from '@/lib/form-errors';
import { formatDistance } from '@/lib/format';
import { useCreateLink } from '@/features/links/api/create-link';
import { getSitesQueryOptions, useSites } from '@/features/sites/api/get-sites';
import { useSitePathGeometry } from '@/features/sites/hooks/use-site-path-geometry';
import { starterDesign } from '@/features/link-design/starter-design';
import { getOrganisationSettingsQueryOptions, useOrganisationSettings } from '@/features/organisation-settings/api/get-organisation-settings';

const useStyles = makeStyles({
  card: { maxWidth: '640px', padding: tokens.spacingHorizontalXXL, display: 'grid', rowGap: tokens.spacingVerticalL },
  row: { display: 'grid', gridTemplateColumns: '1fr 1fr', columnGap: tokens.spacingHorizontalL },
  muted: { color: tokens.colorNeutralForeground3 },
  actions: { display: 'flex', columnGap: tokens.spacingHorizontalS, justifyContent: 'flex-end' },
});

type NewLinkField = 'name' | 'siteAId' | 'siteBId' | 'rangeText';
const LABELS: Record<NewLinkField, string> = { name: 'Link name', siteAId: 'Site A', siteBId: 'Site B', rangeText: 'Path length' };

/**
 * The create request's own name rule; the path length is typed with its unit and read with
 * parseQuantity, and may be left empty when both sites give it (`slantRangeM`).
 */
function newLinkFormSchema(slantRangeM: number | undefined, defaultUnit: DistanceUnit) {
  return z
    .object({ name: CreateLinkRequestSchema.shape.name, siteAId: z.string(), siteBId: z.string(), rangeText: z.string() })
    .superRefine((values, context) => {
      if (values.siteAId && values.siteAId === values.siteBId) context.addIssue({ code: 'custom', path: ['siteBId'], message: 'must differ from site A' });
      if (values.rangeText.trim() === '' && slantRangeM !== undefined) return;
      const parsed = parseQuantity(values.rangeText, 'length', { defaultUnit, allowZero: false });
      if (!parsed.ok) context.addIssue({ code: 'custom', path: ['rangeText'], message: parsed.reason === 'is empty' ? 'is required (or choose both sites)' : parsed.reason });
    })
    .transform((values) => {
      const parsed = parseQuantity(values.rangeText, 'length', { defaultUnit, allowZero: false });
      return { ...values, rangeM: parsed.ok ? parsed.valueSi : (slantRangeM ?? 0) };
    });
}
type NewLinkValues = z.input<ReturnType<typeof newLinkFormSchema>>;

const UNIT_WORD: Record<DistanceUnit, string> = { m: 'metres', km: 'kilometres', mi: 'miles' };

/** The api's paths of a create request, as this form's fields. */
function targetOf(path: string): IssueTarget<NewLinkField> {
  if (path === 'name') return { field: 'name', label: LABELS.name };
  if (path === 'design.rangeM') return { field: 'rangeText', label: LABELS.rangeText };
  if (path === 'siteAId' || path === 'siteBId') return { field: path, label: 'Site' };
  return null;
}

export function NewLinkRoute() {
  const styles = useStyles();
  const navigate = useNavigate();
  const role = useCurrentUser().data?.role;
  const sites = useSites();
  const createLink = useCreateLink();
  // the organisation's defaults; the engine's own while they load or when they cannot be read
  const settings = useOrganisationSettings().data;
  const distanceUnit = settings?.distanceUnit ?? ORGANISATION_DEFAULTS.distanceUnit;
  const defaultUnitRef = useRef<DistanceUnit>(distanceUnit);
  defaultUnitRef.current = distanceUnit;
  // the schema depends on the chosen sites; the resolver reads the latest one
  const slantRangeRef = useRef<number | undefined>(undefined);
  const form = useForm<NewLinkValues, unknown, z.output<ReturnType<typeof newLinkFormSchema>>>({
    defaultValues: { name: '', siteAId: '', siteBId: '', rangeText: '' },
    resolver: withFieldMessages((values, context, options) => zodResolver(newLinkFormSchema(slantRangeRef.current, defaultUnitRef.current))(values, context, options), labelledMessage(LABELS)),
    // the messages beside the fields are announced; the focus stays where the user is
    shouldFocusError: false,
  });
  const { control, formState, handleSubmit, setError, clearErrors } = form;
  const [siteAId, siteBId] = form.watch(['siteAId', 'siteBId']);

  // With both ends chosen, the path length follows from their coordinates and heights.
  const geometry = useSitePathGeometry(siteAId, siteBId)?.geometry ?? null;
  slantRangeRef.current = geometry?.slantRangeM;

  if (role && !policies.canEditDesigns(role)) return <Navigate to={paths.app.links.getHref()} replace />;

  const onSubmit = handleSubmit((values) => {
    createLink.mutate(
      { name: values.name, design: starterDesign(values.rangeM, { fadeProbability: settings?.fadeProbability, visibilityDefinition: settings?.visibilityDefinition }), siteAId: values.siteAId || null, siteBId: values.siteBId || null, note: 'Created with typical starting values' },
      {
        onSuccess: (link) => navigate(paths.app.link.getHref(link.id)),
        onError: (error) => {
          const mapped = setApiFieldErrors(error, setError, targetOf);
          if (!mapped) setError('root', { message: error instanceof Error ? error.message : 'The link could not be created.' });
          else if (mapped.unmatched.length > 0) setError('root', { message: mapped.unmatched.map((issue) => `${issue.path}: ${issue.message}`).join('; ') });
        },
      },
    );
  });
  const errors = formState.errors;
  // Choosing either site changes the path, so the site and path errors no longer apply.
  const clearSiteErrors = () => clearErrors(['siteAId', 'siteBId', 'rangeText']);

  return (
    <Card className={styles.card}>
      <div>
        <Title2 as="h1">New link</Title2>
        <div>
          <Body1 className={styles.muted}>
            Name the link and give its path; it starts from typical figures of a 1550 nm rooftop terminal, to be replaced by your
            equipment in the workspace.
          </Body1>
        </div>
      </div>
      <form onSubmit={onSubmit} noValidate style={{ display: 'grid', rowGap: 16 }} aria-label="New link">
        {errors.root && (
          <MessageBar intent="error">
            <MessageBarBody>{errors.root.message}</MessageBarBody>
          </MessageBar>
        )}
        <Controller
          name="name"
          control={control}
          render={({ field, fieldState }) => (
            <Field label={LABELS.name} required validationMessage={fieldState.error?.message} validationState={fieldState.error ? 'error' : 'none'}>
              <Input {...field} onChange={(_, data) => field.onChange(data.value)} maxLength={200} placeholder="e.g. Harbour office to depot" />
            </Field>
          )}
        />
        <div className={styles.row}>
          {(['siteAId', 'siteBId'] as const).map((name) => (
            <Controller
              key={name}
              name={name}
              control={control}
              render={({ field, fieldState }) => (
                <SiteSelectField
                  label={LABELS[name]}
                  sites={sites.data}
                  value={field.value}
                  error={fieldState.error?.message}
                  onChange={(value) => {
                    field.onChange(value);
                    clearSiteErrors();
                  }}
                />
              )}
            />
          ))}
        </div>
        <Controller
          name="rangeText"
          control={control}
          render={({ field, fieldState }) => (
            <Field
              label={LABELS.rangeText}
              required={!geometry}
              validationMessage={fieldState.error?.message}
              validationState={fieldState.error ? 'error' : 'none'}
              hint={geometry ? `From the two sites: ${formatDistance(geometry.slantRangeM)} slant range. Type a value to override it.` : `e.g. 2.4 km or 850 m; a number alone is read in ${UNIT_WORD[distanceUnit]}`}
            >
              <Input {...field} onChange={(_, data) => field.onChange(data.value)} placeholder={geometry ? formatDistance(geometry.slantRangeM) : 'e.g. 2.4 km'} />
            </Field>
          )}
        />
        <Caption1 className={styles.muted} data-testid="new-link-defaults">
          The starting figures are illustrative, not a recommendation. From your organisation&apos;s settings: fade probability{' '}
          {settings?.fadeProbability ?? ORGANISATION_DEFAULTS.fadeProbability}, visibility on the{' '}
          {(settings?.visibilityDefinition ?? ORGANISATION_DEFAULTS.visibilityDefinition) === 'mor-5-percent' ? '5 % (MOR)' : '2 %'} contrast definition, and a
          required margin of {settings?.requiredMarginDb ?? ORGANISATION_DEFAULTS.requiredMarginDb} dB.
        </Caption1>
        <div className={styles.actions}>
          <Button onClick={() => navigate(paths.app.links.getHref())}>Cancel</Button>
          <Button type="submit" appearance="primary" disabled={createLink.isPending} icon={createLink.isPending ? <Spinner size="tiny" /> : undefined}>
            Create and open
          </Button>
        </div>
      </form>
    </Card>
  );
}

/** Starts loading the site choices with the queryOptions useSites reads. */
export const createLoader = (queryClient: QueryClient) => () => {
  void queryClient.prefetchQuery(getSitesQueryOptions());
  void queryClient.prefetchQuery(getOrganisationSettingsQueryOptions());
  return null;
};

export const Component = NewLinkRoute;

interface SiteSelectFieldProps {
  label: string;
  sites: ReadonlyArray<{ id: string; name: string }> | undefined;
  value: string;
  error: string | undefined;
  onChange: (siteId: string) => void;
}

function SiteSelectField({ label, sites, value, error, onChange }: SiteSelectFieldProps) {
  return (
    <Field label={label} validationMessage={error} validationState={error ? 'error' : 'none'} hint="Optional">
      <Select value={value} onChange={(_, data) => onChange(data.value)}>
        <option value="">No site yet</option>
        {sites?.map((site) => (
          <option key={site.id} value={site.id}>
            {site.name}
          </option>
        ))}
      </Select>
    </Field>
  );
}

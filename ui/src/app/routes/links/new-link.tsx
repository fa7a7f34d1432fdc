import { useState, type FormEvent } from 'react';
import { Navigate, useNavigate } from 'react-router-dom';
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
import { parseQuantity } from '@beamwright/link-core/units';
import { paths } from '@/config/paths';
import { policies, useCurrentUser } from '@/lib/auth';
import { isApiError } from '@/lib/api-client';
import { formatDistance } from '@/lib/format';
import { useCreateLink } from '@/features/links/api/create-link';
import { useSites } from '@/features/sites/api/get-sites';
import { useSitePathGeometry } from '@/features/sites/hooks/use-site-path-geometry';
import { starterDesign } from '@/features/link-design/starter-design';

const useStyles = makeStyles({
  card: { maxWidth: '640px', padding: tokens.spacingHorizontalXXL, display: 'grid', rowGap: tokens.spacingVerticalL },
  row: { display: 'grid', gridTemplateColumns: '1fr 1fr', columnGap: tokens.spacingHorizontalL },
  muted: { color: tokens.colorNeutralForeground3 },
  actions: { display: 'flex', columnGap: tokens.spacingHorizontalS, justifyContent: 'flex-end' },
});

type Errors = Partial<Record<'name' | 'rangeM' | 'siteAId' | 'siteBId' | 'form', string>>;

export function NewLinkRoute() {
  const styles = useStyles();
  const navigate = useNavigate();
  const role = useCurrentUser().data?.role;
  const sites = useSites();
  const createLink = useCreateLink();
  const [name, setName] = useState('');
  const [rangeText, setRangeText] = useState('');
  const [siteAId, setSiteAId] = useState('');
  const [siteBId, setSiteBId] = useState('');
  const [errors, setErrors] = useState<Errors>({});
  // Choosing either site changes the path, so the site and path errors no longer apply.
  const clearSiteErrors = () => setErrors((current) => ({ ...current, siteAId: undefined, siteBId: undefined, rangeM: undefined }));

  // With both ends chosen, the path length follows from their coordinates and heights.
  const geometry = useSitePathGeometry(siteAId, siteBId)?.geometry ?? null;

  if (role && !policies.canEditDesigns(role)) return <Navigate to={paths.app.links.getHref()} replace />;

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    const next: Errors = {};
    if (name.trim() === '') next.name = 'Link name is required';
    let rangeM = geometry?.slantRangeM;
    if (rangeText.trim() !== '' || rangeM === undefined) {
      const parsed = parseQuantity(rangeText, 'length', { defaultUnit: 'km', allowZero: false });
      if (!parsed.ok) next.rangeM = `Path length ${parsed.reason === 'is empty' ? 'is required (or choose both sites)' : parsed.reason}`;
      else rangeM = parsed.valueSi;
    }
    if (siteAId && siteAId === siteBId) next.siteBId = 'Site B must differ from site A';
    setErrors(next);
    if (Object.keys(next).length > 0 || rangeM === undefined) return;
    createLink.mutate(
      { name: name.trim(), design: starterDesign(rangeM), siteAId: siteAId || null, siteBId: siteBId || null, note: 'Created with typical starting values' },
      {
        onSuccess: (link) => navigate(paths.app.link.getHref(link.id)),
        onError: (error) => {
          if (isApiError(error, 400) && error.issues.length > 0) {
            const mapped: Errors = {};
            for (const issue of error.issues) {
              if (issue.path === 'name') mapped.name = `Link name ${issue.message}`;
              else if (issue.path === 'design.rangeM') mapped.rangeM = `Path length ${issue.message}`;
              else if (issue.path === 'siteAId' || issue.path === 'siteBId') mapped[issue.path] = `Site ${issue.message}`;
              else mapped.form = `${issue.path}: ${issue.message}`;
            }
            setErrors(mapped);
          } else {
            setErrors({ form: error instanceof Error ? error.message : 'The link could not be created.' });
          }
        },
      },
    );
  };

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
        {errors.form && (
          <MessageBar intent="error">
            <MessageBarBody>{errors.form}</MessageBarBody>
          </MessageBar>
        )}
        <Field label="Link name" required validationMessage={errors.name} validationState={errors.name ? 'error' : 'none'}>
          <Input
            value={name}
            onChange={(_, data) => {
              setName(data.value);
              setErrors((current) => ({ ...current, name: undefined }));
            }}
            maxLength={200}
            placeholder="e.g. Harbour office to depot"
          />
        </Field>
        <div className={styles.row}>
          <SiteSelectField
            label="Site A"
            sites={sites.data}
            value={siteAId}
            error={errors.siteAId}
            onChange={(value) => {
              setSiteAId(value);
              clearSiteErrors();
            }}
          />
          <SiteSelectField
            label="Site B"
            sites={sites.data}
            value={siteBId}
            error={errors.siteBId}
            onChange={(value) => {
              setSiteBId(value);
              clearSiteErrors();
            }}
          />
        </div>
        <Field
          label="Path length"
          required={!geometry}
          validationMessage={errors.rangeM}
          validationState={errors.rangeM ? 'error' : 'none'}
          hint={geometry ? `From the two sites: ${formatDistance(geometry.slantRangeM)} slant range. Type a value to override it.` : 'e.g. 2.4 km or 850 m'}
        >
          <Input
            value={rangeText}
            onChange={(_, data) => {
              setRangeText(data.value);
              setErrors((current) => ({ ...current, rangeM: undefined }));
            }}
            placeholder={geometry ? formatDistance(geometry.slantRangeM) : 'e.g. 2.4 km'} />
        </Field>
        <Caption1 className={styles.muted}>The starting figures are illustrative, not a recommendation.</Caption1>
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

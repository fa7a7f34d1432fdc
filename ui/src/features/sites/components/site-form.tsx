import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Button, Field, Input, MessageBar, MessageBarBody, Spinner, Textarea, makeStyles, tokens } from '@fluentui/react-components';
import { formatDegreesMinutesSeconds } from '@beamwright/link-core';
import { CreateSiteRequestSchema, type CreateSiteRequest, type SiteResponse } from '@beamwright/link-core/contracts';
import { labelledMessage, setApiFieldErrors, withFieldMessages, type IssueTarget } from '@/lib/form-errors';

const useStyles = makeStyles({
  form: { display: 'grid', rowGap: tokens.spacingVerticalL, maxWidth: '720px' },
  row: { display: 'grid', gridTemplateColumns: 'repeat(auto-fit, minmax(min(240px, 100%), 1fr))', gap: tokens.spacingHorizontalL },
  actions: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS, justifyContent: 'flex-end' },
});

type SiteField = 'name' | 'latitudeDeg' | 'longitudeDeg' | 'groundElevationM' | 'mountHeightM' | 'notes';
const LABELS: Record<SiteField, string> = {
  name: 'Site name',
  latitudeDeg: 'Latitude',
  longitudeDeg: 'Longitude',
  groundElevationM: 'Ground elevation (m)',
  mountHeightM: 'Mount height (m)',
  notes: 'Notes',
};

const shape = CreateSiteRequestSchema.shape;

/** A number typed as text, then the contract's own bounds. */
function numberText(schema: z.ZodType<number, number>) {
  return z
    .string()
    .transform((text, context) => {
      const trimmed = text.trim().replace(/[−–]/g, '-');
      if (trimmed === '') {
        context.addIssue({ code: 'custom', message: 'is required' });
        return z.NEVER;
      }
      const value = Number(trimmed);
      if (!Number.isFinite(value)) {
        context.addIssue({ code: 'custom', message: 'must be a number of metres' });
        return z.NEVER;
      }
      return value;
    })
    .pipe(schema);
}

/** The contract's fields (coordinates read as decimal degrees or DMS by the contract itself). */
const siteFormSchema = z.object({
  name: shape.name,
  latitudeDeg: shape.latitudeDeg,
  longitudeDeg: shape.longitudeDeg,
  groundElevationM: numberText(shape.groundElevationM),
  mountHeightM: numberText(shape.mountHeightM),
  notes: shape.notes,
});
type SiteFormValues = z.input<typeof siteFormSchema>;
type SiteFormOutput = z.output<typeof siteFormSchema>;

/** What the coordinate field understood, in both notations; null while it reads as nothing. */
export function describeCoordinate(text: string, axis: 'latitude' | 'longitude'): string | null {
  if (text.trim() === '') return null;
  const parsed = (axis === 'latitude' ? shape.latitudeDeg : shape.longitudeDeg).safeParse(text);
  if (!parsed.success) return null;
  const value = parsed.data;
  const letter = axis === 'latitude' ? (value < 0 ? 'S' : 'N') : value < 0 ? 'W' : 'E';
  return `Read as ${value.toFixed(6)}° = ${formatDegreesMinutesSeconds(Math.abs(value), { secondsDecimals: 2 })} ${letter}`;
}

function targetOf(path: string): IssueTarget<SiteField> {
  return path in LABELS ? { field: path as SiteField, label: LABELS[path as SiteField] } : null;
}

export interface SiteFormProps {
  site?: SiteResponse;
  pending: boolean;
  onSubmit: (input: CreateSiteRequest, handlers: { onError: (error: unknown) => void }) => void;
  onCancel: () => void;
}

export function SiteForm({ site, pending, onSubmit, onCancel }: SiteFormProps) {
  const styles = useStyles();
  const form = useForm<SiteFormValues, unknown, SiteFormOutput>({
    defaultValues: {
      name: site?.name ?? '',
      latitudeDeg: site ? String(site.latitudeDeg) : '',
      longitudeDeg: site ? String(site.longitudeDeg) : '',
      groundElevationM: site ? String(site.groundElevationM) : '',
      mountHeightM: site ? String(site.mountHeightM) : '',
      notes: site?.notes ?? '',
    },
    resolver: withFieldMessages(zodResolver(siteFormSchema), labelledMessage(LABELS)),
    shouldFocusError: false,
  });
  const { control, handleSubmit, setError, formState } = form;
  const [latitudeText, longitudeText] = form.watch(['latitudeDeg', 'longitudeDeg']).map((value) => String(value ?? ''));

  const submit = handleSubmit((values) =>
    onSubmit(values, {
      onError: (error) => {
        const mapped = setApiFieldErrors(error, setError, targetOf);
        if (!mapped) setError('root', { message: error instanceof Error ? error.message : 'The site could not be saved.' });
        else if (mapped.unmatched.length > 0) setError('root', { message: mapped.unmatched.map((issue) => `${issue.path}: ${issue.message}`).join('; ') });
      },
    }),
  );

  const text = (name: SiteField, props: { hint?: string; placeholder?: string; required?: boolean } = {}) => (
    <Controller
      name={name}
      control={control}
      render={({ field, fieldState }) => (
        <Field label={LABELS[name]} required={props.required ?? true} hint={props.hint} validationMessage={fieldState.error?.message} validationState={fieldState.error ? 'error' : 'none'}>
          <Input {...field} value={String(field.value ?? '')} onChange={(_, data) => field.onChange(data.value)} placeholder={props.placeholder} autoComplete="off" />
        </Field>
      )}
    />
  );

  return (
    <form onSubmit={submit} noValidate className={styles.form} aria-label={site ? `Edit ${site.name}` : 'New site'}>
      {formState.errors.root && (
        <MessageBar intent="error">
          <MessageBarBody>{formState.errors.root.message}</MessageBarBody>
        </MessageBar>
      )}
      {text('name', { placeholder: 'e.g. Harbour Office tower' })}
      <div className={styles.row}>
        {text('latitudeDeg', {
          hint: describeCoordinate(latitudeText, 'latitude') ?? 'Decimal degrees or degrees, minutes, seconds: 56.0133 or 56°00′47.8″N (WGS 84)',
          placeholder: '56°00′47.8″N',
        })}
        {text('longitudeDeg', {
          hint: describeCoordinate(longitudeText, 'longitude') ?? 'Decimal degrees or DMS: 10.0192 or 10 01 09.2 E (west negative or W)',
          placeholder: '10°01′09.2″E',
        })}
      </div>
      <div className={styles.row}>
        {text('groundElevationM', { hint: 'Ground or roof base above mean sea level', placeholder: 'e.g. 12' })}
        {text('mountHeightM', { hint: 'The terminal above the ground elevation', placeholder: 'e.g. 9' })}
      </div>
      <Controller
        name="notes"
        control={control}
        render={({ field, fieldState }) => (
          <Field label={LABELS.notes} hint="Access, mounting, permits" validationMessage={fieldState.error?.message} validationState={fieldState.error ? 'error' : 'none'}>
            <Textarea {...field} onChange={(_, data) => field.onChange(data.value)} resize="vertical" rows={3} />
          </Field>
        )}
      />
      <div className={styles.actions}>
        <Button onClick={onCancel}>Cancel</Button>
        <Button type="submit" appearance="primary" disabled={pending} icon={pending ? <Spinner size="tiny" /> : undefined}>
          {site ? 'Save site' : 'Add site'}
        </Button>
      </div>
    </form>
  );
}

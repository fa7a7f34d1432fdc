import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Button, Field, Input, MessageBar, MessageBarBody, Select, Spinner, makeStyles, tokens } from '@fluentui/react-components';
import { UpdateOrganisationSettingsRequestSchema, DISTANCE_UNITS, type DistanceUnit, type OrganisationSettings, type UpdateOrganisationSettingsRequest } from '@beamwright/link-core/contracts';
import { labelledMessage, setApiFieldErrors, withFieldMessages, type IssueTarget } from '@/lib/form-errors';

const useStyles = makeStyles({
  form: { display: 'grid', rowGap: tokens.spacingVerticalL, maxWidth: '640px' },
  row: { display: 'grid', gridTemplateColumns: 'repeat(auto-fit, minmax(min(240px, 100%), 1fr))', gap: tokens.spacingHorizontalL },
  actions: { display: 'flex', justifyContent: 'flex-end' },
});

type SettingsField = 'name' | 'requiredMarginDb' | 'fadeProbability' | 'visibilityDefinition' | 'distanceUnit';
const LABELS: Record<SettingsField, string> = {
  name: 'Organisation name',
  requiredMarginDb: 'Required link margin (dB)',
  fadeProbability: 'Fade probability',
  visibilityDefinition: 'Visibility definition',
  distanceUnit: 'Distance unit',
};

export const VISIBILITY_DEFINITION_LABELS = {
  'contrast-2-percent': '2 % contrast (classical; what Kim and Kruse assume)',
  'mor-5-percent': '5 % contrast, meteorological optical range (airport sensors, METAR)',
} as const;

const DISTANCE_UNIT_LABELS: Record<DistanceUnit, string> = { m: 'metres (m)', km: 'kilometres (km)', mi: 'miles (mi)' };

const shape = UpdateOrganisationSettingsRequestSchema.shape;
/** A number typed as text, then the contract's bounds. */
const numberText = (schema: z.ZodType<number, number>) =>
  z
    .string()
    .transform((text, context) => {
      const value = Number(text.trim());
      if (text.trim() === '' || !Number.isFinite(value)) {
        context.addIssue({ code: 'custom', message: text.trim() === '' ? 'is required' : 'must be a number' });
        return z.NEVER;
      }
      return value;
    })
    .pipe(schema);

const formSchema = z.object({
  name: shape.name.unwrap(),
  requiredMarginDb: numberText(shape.requiredMarginDb.unwrap()),
  fadeProbability: numberText(shape.fadeProbability.unwrap()),
  visibilityDefinition: shape.visibilityDefinition.unwrap(),
  distanceUnit: shape.distanceUnit.unwrap(),
});
type FormValues = z.input<typeof formSchema>;

const targetOf = (path: string): IssueTarget<SettingsField> => (path in LABELS ? { field: path as SettingsField, label: LABELS[path as SettingsField] } : null);

export interface OrganisationSettingsFormProps {
  settings: OrganisationSettings;
  pending: boolean;
  saved: boolean;
  onSubmit: (changes: UpdateOrganisationSettingsRequest, handlers: { onError: (error: unknown) => void }) => void;
}

export function OrganisationSettingsForm({ settings, pending, saved, onSubmit }: OrganisationSettingsFormProps) {
  const styles = useStyles();
  const form = useForm<FormValues, unknown, z.output<typeof formSchema>>({
    defaultValues: {
      name: settings.name,
      requiredMarginDb: String(settings.requiredMarginDb),
      fadeProbability: String(settings.fadeProbability),
      visibilityDefinition: settings.visibilityDefinition,
      distanceUnit: settings.distanceUnit,
    },
    resolver: withFieldMessages(zodResolver(formSchema), labelledMessage(LABELS)),
    shouldFocusError: false,
  });
  const { control, handleSubmit, setError, formState } = form;
  const submit = handleSubmit((values) =>
    onSubmit(values, {
      onError: (error) => {
        const mapped = setApiFieldErrors(error, setError, targetOf);
        if (!mapped) setError('root', { message: error instanceof Error ? error.message : 'The settings could not be saved.' });
      },
    }),
  );
  const error = (name: SettingsField) => formState.errors[name]?.message;
  return (
    <form onSubmit={submit} noValidate className={styles.form} aria-label="Organisation settings">
      {formState.errors.root && (
        <MessageBar intent="error">
          <MessageBarBody>{formState.errors.root.message}</MessageBarBody>
        </MessageBar>
      )}
      {saved && !formState.isDirty && (
        <MessageBar intent="success" role="status">
          <MessageBarBody>Settings saved. New links start from these defaults.</MessageBarBody>
        </MessageBar>
      )}
      <Controller
        name="name"
        control={control}
        render={({ field }) => (
          <Field label={LABELS.name} required validationMessage={error('name')} validationState={error('name') ? 'error' : 'none'}>
            <Input {...field} onChange={(_, data) => field.onChange(data.value)} maxLength={200} />
          </Field>
        )}
      />
      <div className={styles.row}>
        <Controller
          name="requiredMarginDb"
          control={control}
          render={({ field }) => (
            <Field label={LABELS.requiredMarginDb} required hint="What a link should keep above the receiver's needs; 3 dB is common practice" validationMessage={error('requiredMarginDb')} validationState={error('requiredMarginDb') ? 'error' : 'none'}>
              <Input {...field} onChange={(_, data) => field.onChange(data.value)} inputMode="decimal" />
            </Field>
          )}
        />
        <Controller
          name="fadeProbability"
          control={control}
          render={({ field }) => (
            <Field label={LABELS.fadeProbability} required hint="The scintillation fade a new design holds margin against, e.g. 0.001" validationMessage={error('fadeProbability')} validationState={error('fadeProbability') ? 'error' : 'none'}>
              <Input {...field} onChange={(_, data) => field.onChange(data.value)} inputMode="decimal" />
            </Field>
          )}
        />
      </div>
      <div className={styles.row}>
        <Controller
          name="visibilityDefinition"
          control={control}
          render={({ field }) => (
            <Field label={LABELS.visibilityDefinition} validationMessage={error('visibilityDefinition')} validationState={error('visibilityDefinition') ? 'error' : 'none'}>
              <Select value={field.value} onChange={(_, data) => field.onChange(data.value as FormValues['visibilityDefinition'])}>
                {Object.entries(VISIBILITY_DEFINITION_LABELS).map(([value, label]) => (
                  <option key={value} value={value}>
                    {label}
                  </option>
                ))}
              </Select>
            </Field>
          )}
        />
        <Controller
          name="distanceUnit"
          control={control}
          render={({ field }) => (
            <Field label={LABELS.distanceUnit} hint="A path length typed without a unit is read in it" validationMessage={error('distanceUnit')} validationState={error('distanceUnit') ? 'error' : 'none'}>
              <Select value={field.value} onChange={(_, data) => field.onChange(data.value as DistanceUnit)}>
                {DISTANCE_UNITS.map((unit) => (
                  <option key={unit} value={unit}>
                    {DISTANCE_UNIT_LABELS[unit]}
                  </option>
                ))}
              </Select>
            </Field>
          )}
        />
      </div>
      <div className={styles.actions}>
        <Button type="submit" appearance="primary" disabled={pending} icon={pending ? <Spinner size="tiny" /> : undefined}>
          Save settings
        </Button>
      </div>
    </form>
  );
}

import { useId, useMemo, useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import {
  Badge,
  Body1,
  Button,
  Caption1,
  Field,
  Input,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  ProgressBar,
  Radio,
  RadioGroup,
  Select,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { VISIBILITY_DEFINITIONS } from '@beamwright/link-core';
import {
  ErrorBodySchema,
  VISIBILITY_UNITS,
  VISIBILITY_UNIT_LABELS,
  WEATHER_OPTIONAL_COLUMNS,
  WEATHER_UPLOAD_LIMITS,
  WeatherDatasetUploadSchema,
  WeatherRowErrorsBodySchema,
  readWeatherRow,
  resolveWeatherColumns,
  type OptionalWeatherColumn,
  type WeatherColumnMapping,
  type WeatherDatasetUpload,
  type WeatherImportJob,
  type WeatherImportResult,
} from '@beamwright/link-core/contracts';
import { isApiError } from '@/lib/api-client';
import { setApiFieldErrors, type IssueTarget } from '@/lib/form-errors';
import { readCsvPreview, type CsvPreview } from '@/features/weather/csv-preview';
import { useUploadWeatherDataset } from '@/features/weather/api/upload-weather-dataset';
import { isImportEnded, useWeatherImport } from '@/features/weather/api/get-weather-import';
import { useCancelWeatherImport } from '@/features/weather/api/cancel-weather-import';
import { RowErrorsTable } from '@/features/weather/components/row-errors-table';

const useStyles = makeStyles({
  root: { display: 'grid', rowGap: tokens.spacingVerticalL, minWidth: 0 },
  grid: { display: 'grid', gridTemplateColumns: 'repeat(auto-fit, minmax(min(220px, 100%), 1fr))', gap: tokens.spacingHorizontalM },
  preview: { overflowX: 'auto', maxWidth: '100%' },
  cellNumber: { fontVariantNumeric: 'tabular-nums' },
  muted: { color: tokens.colorNeutralForeground3 },
  actions: { display: 'flex', columnGap: tokens.spacingHorizontalS, flexWrap: 'wrap', alignItems: 'center' },
  fileInput: { font: 'inherit', color: 'inherit', maxWidth: '100%' },
  progress: { display: 'grid', rowGap: tokens.spacingVerticalXS, maxWidth: '640px' },
  list: { margin: 0, paddingInlineStart: tokens.spacingHorizontalL },
  intro: { display: 'grid', rowGap: tokens.spacingVerticalXS },
});

type MappingField = keyof WeatherColumnMapping;
type FormField = 'name' | 'notes' | 'siteId' | 'onRowErrors' | `mapping.${MappingField}`;

const LABELS: Record<FormField, string> = {
  name: 'Data set name',
  notes: 'Notes',
  siteId: 'Site',
  onRowErrors: 'Rows that cannot be read',
  'mapping.timestampColumn': 'Timestamp column',
  'mapping.visibilityColumn': 'Visibility column',
  'mapping.visibilityUnit': 'Visibility unit',
  'mapping.visibilityDefinition': 'Visibility definition',
  'mapping.rainRateColumn': `${WEATHER_OPTIONAL_COLUMNS.rainRateColumn.label} column`,
  'mapping.snowRateColumn': `${WEATHER_OPTIONAL_COLUMNS.snowRateColumn.label} column`,
  'mapping.temperatureColumn': `${WEATHER_OPTIONAL_COLUMNS.temperatureColumn.label} column`,
  'mapping.cn2Column': `${WEATHER_OPTIONAL_COLUMNS.cn2Column.label} column`,
};

interface FormValues {
  name: string;
  notes: string;
  siteId: string;
  onRowErrors: 'reject' | 'skip';
  mapping: Record<MappingField, string>;
}

/** An empty select or field means "none": dropped before the contract's schema reads the form. */
function withoutEmpty(values: unknown): unknown {
  if (!values || typeof values !== 'object') return values;
  return Object.fromEntries(Object.entries(values).flatMap(([key, value]) => (value === '' ? [] : [[key, key === 'mapping' ? withoutEmpty(value) : value]])));
}
const FormSchema = z
  .custom<FormValues>((value) => typeof value === 'object' && value !== null)
  .transform((values) => withoutEmpty(values) as WeatherDatasetUpload)
  .pipe(WeatherDatasetUploadSchema);

/** The api's issue paths as this form's fields; `file` and the rest go beside the file or above the form. */
function targetOf(path: string): IssueTarget<FormField> {
  return path in LABELS ? { field: path as FormField } : null;
}

/** Short enough for a select; the contract's longer labels go into the hint and the data set table. */
const SHORT_DEFINITION_LABELS: Record<(typeof VISIBILITY_DEFINITIONS)[number], string> = { 'mor-5-percent': 'MOR (5 % contrast)', 'contrast-2-percent': '2 % contrast' };

const OPTIONAL_FIELDS = Object.keys(WEATHER_OPTIONAL_COLUMNS) as OptionalWeatherColumn[];
const megabytes = (bytes: number) => `${(bytes / (1024 * 1024)).toFixed(bytes < 10 * 1024 * 1024 ? 2 : 1)} MB`;

function defaultValues(file: File, preview: CsvPreview, siteId: string | undefined): FormValues {
  const guess = preview.guess;
  return {
    name: file.name.replace(/\.(csv|txt)(\.gz)?$|\.gz$/i, '').slice(0, 200),
    notes: '',
    siteId: siteId ?? '',
    onRowErrors: 'reject',
    mapping: {
      timestampColumn: guess.timestampColumn ?? '',
      visibilityColumn: guess.visibilityColumn ?? '',
      visibilityUnit: guess.visibilityUnit ?? '',
      visibilityDefinition: guess.visibilityDefinition ?? '',
      rainRateColumn: guess.rainRateColumn ?? '',
      snowRateColumn: guess.snowRateColumn ?? '',
      temperatureColumn: guess.temperatureColumn ?? '',
      cn2Column: guess.cn2Column ?? '',
    },
  };
}

type Step =
  | { kind: 'choose' }
  | { kind: 'map'; file: File; preview: CsvPreview }
  | { kind: 'uploading'; file: File; preview: CsvPreview; sent: number; total: number }
  | { kind: 'processing'; file: File; preview: CsvPreview; jobId: string; fields: WeatherDatasetUpload }
  | { kind: 'imported'; result: WeatherImportResult; name: string }
  | { kind: 'refused'; file: File; preview: CsvPreview; fields: WeatherDatasetUpload; error: NonNullable<WeatherImportJob['error']> };

/**
 * Upload of a weather file in three steps: choose the file (its first rows are read in the browser),
 * map its columns (guessed from the header and the first rows; checked with the contract's schema),
 * then the upload with its progress and the import job with its own. Rows that cannot be read are
 * listed with line, column and reason; the user fixes the file or imports only the valid rows.
 */
export function WeatherImportForm({ sites, defaultSiteId }: { sites: readonly { id: string; name: string }[]; defaultSiteId?: string }) {
  const styles = useStyles();
  const fileInputId = useId();
  const [step, setStep] = useState<Step>({ kind: 'choose' });
  const [fileError, setFileError] = useState<string | null>(null);
  const upload = useUploadWeatherDataset();
  const form = useForm<FormValues, unknown, z.output<typeof WeatherDatasetUploadSchema>>({
    resolver: zodResolver(FormSchema),
    shouldFocusError: false,
  });
  const job = useWeatherImport(step.kind === 'processing' ? step.jobId : null);
  const cancel = useCancelWeatherImport();

  const chooseFile = async (file: File | undefined) => {
    setFileError(null);
    upload.reset();
    if (!file) return setStep({ kind: 'choose' });
    if (file.size > WEATHER_UPLOAD_LIMITS.maxBytes) {
      setFileError(`The file is ${megabytes(file.size)}, over the ${WEATHER_UPLOAD_LIMITS.maxBytes / (1024 * 1024)} MB one upload takes: compress it with gzip, or split it.`);
      return setStep({ kind: 'choose' });
    }
    try {
      const preview = await readCsvPreview(file);
      if (preview.header.length < 2) throw new Error('its first line has fewer than two columns');
      form.reset(defaultValues(file, preview, defaultSiteId));
      setStep({ kind: 'map', file, preview });
    } catch (error) {
      setFileError(`This file cannot be read as CSV: ${error instanceof Error ? error.message : 'unknown problem'}.`);
      setStep({ kind: 'choose' });
    }
  };

  const send = (file: File, preview: CsvPreview, fields: WeatherDatasetUpload) => {
    setStep({ kind: 'uploading', file, preview, sent: 0, total: file.size });
    upload.mutate(
      { file, fields, onUploadProgress: (sent, total) => setStep((current) => (current.kind === 'uploading' ? { ...current, sent, total: total || current.total } : current)) },
      {
        onSuccess: (answer) => {
          if (answer.kind === 'imported') setStep({ kind: 'imported', result: answer.result, name: fields.name });
          else setStep({ kind: 'processing', file, preview, jobId: answer.job.jobId, fields });
        },
        onError: (error) => {
          setStep({ kind: 'map', file, preview });
          if (isApiError(error, 413) || isApiError(error, 415)) return setFileError(error.message);
          if (isApiError(error, 422)) {
            const body = WeatherRowErrorsBodySchema.safeParse(error.body);
            if (body.success) return setStep({ kind: 'refused', file, preview, fields, error: body.data });
          }
          const mapped = setApiFieldErrors(error, form.setError, targetOf);
          const fileIssue = isApiError(error, 400) ? ErrorBodySchema.safeParse(error.body).data?.issues?.find((issue) => issue.path === 'file') : undefined;
          if (fileIssue) setFileError(`The file ${fileIssue.message}`);
          if (!mapped) form.setError('root', { message: error instanceof Error ? error.message : 'The upload failed.' });
          else if (mapped.unmatched.some((issue) => issue.path !== 'file')) {
            form.setError('root', { message: mapped.unmatched.filter((issue) => issue.path !== 'file').map((issue) => `${issue.path}: ${issue.message}`).join('; ') });
          }
        },
      },
    );
  };

  // the processing job: once it has ended, the outcome replaces the progress
  const jobData = job.data;
  if (step.kind === 'processing' && jobData && isImportEnded(jobData)) {
    if (jobData.state === 'succeeded' && jobData.result) setStep({ kind: 'imported', result: jobData.result, name: step.fields.name });
    else if (jobData.error) setStep({ kind: 'refused', file: step.file, preview: step.preview, fields: step.fields, error: jobData.error });
  }

  const onSubmit = form.handleSubmit((fields) => {
    if (step.kind !== 'map') return;
    setFileError(null);
    send(step.file, step.preview, fields);
  });

  const fileField = (
    <Field
      label="Weather file (CSV, or CSV compressed with gzip)"
      hint={`Up to ${WEATHER_UPLOAD_LIMITS.maxBytes / (1024 * 1024)} MB and ${WEATHER_UPLOAD_LIMITS.maxRows.toLocaleString('en-GB')} rows; one row per observation, a header row first.`}
      validationMessage={fileError ?? undefined}
      validationState={fileError ? 'error' : 'none'}
    >
      {(fieldProps) => (
        <input
          {...fieldProps}
          id={fileInputId}
          type="file"
          className={styles.fileInput}
          accept=".csv,.txt,.gz,text/csv,application/gzip"
          data-testid="weather-file-input"
          disabled={step.kind === 'uploading' || step.kind === 'processing'}
          onChange={(event) => void chooseFile(event.target.files?.[0])}
        />
      )}
    </Field>
  );

  return (
    <div className={styles.root}>
      {fileField}
      {(step.kind === 'map' || step.kind === 'uploading') && (
        <MappingStep step={step} form={form} sites={sites} onSubmit={onSubmit} busy={step.kind === 'uploading'} />
      )}
      {step.kind === 'uploading' && (
        <div className={styles.progress}>
          <Field label={`Uploading ${step.file.name}`} validationMessage={`${step.total > 0 ? Math.floor((100 * step.sent) / step.total) : 0} %: ${megabytes(step.sent)} of ${megabytes(step.total)} sent`} validationState="none">
            <ProgressBar value={step.total > 0 ? step.sent / step.total : undefined} max={1} aria-label={`Uploading ${step.file.name}`} data-testid="upload-progress" />
          </Field>
        </div>
      )}
      {step.kind === 'processing' && (
        <div className={styles.progress} role="status" aria-live="polite">
          <Field
            label={jobData?.state === 'queued' ? 'Waiting for an import worker' : 'Reading and checking the rows'}
            validationMessage={
              jobData ? `${jobData.rowsRead.toLocaleString('en-GB')} rows read, ${megabytes(jobData.bytesRead)} of ${megabytes(jobData.bytesTotal)}${jobData.attempt > 1 ? ` (run ${jobData.attempt}: an earlier run was interrupted)` : ''}` : 'Starting…'
            }
            validationState="none"
          >
            <ProgressBar value={jobData?.progress ?? undefined} max={1} aria-label="Processing the import" data-testid="processing-progress" />
          </Field>
          <div className={styles.actions}>
            <Button disabled={cancel.isPending} onClick={() => cancel.mutate(step.jobId)}>
              Cancel the import
            </Button>
            <Caption1 className={styles.muted}>Nothing is stored until every row is in; a cancelled import leaves no trace.</Caption1>
          </div>
        </div>
      )}
      {step.kind === 'imported' && (
        <MessageBar intent="success" data-testid="import-outcome">
          <MessageBarBody>
            <MessageBarTitle>Imported “{step.name}”</MessageBarTitle>
            {step.result.rowsImported.toLocaleString('en-GB')} row{step.result.rowsImported === 1 ? '' : 's'}
            {step.result.missingVisibilityCount > 0 ? `, ${step.result.missingVisibilityCount.toLocaleString('en-GB')} of them without a visibility reading (counted as missing data)` : ''}
            {step.result.rowErrorCount > 0 ? `; ${step.result.rowErrorCount.toLocaleString('en-GB')} row${step.result.rowErrorCount === 1 ? '' : 's'} left out, listed below` : ''}.
          </MessageBarBody>
        </MessageBar>
      )}
      {step.kind === 'imported' && step.result.rowErrorCount > 0 && <RowErrorsTable rowErrors={step.result.rowErrors} rowErrorCount={step.result.rowErrorCount} caption="Rows left out" />}
      {step.kind === 'refused' && (
        <div className={styles.root} data-testid="import-outcome">
          <MessageBar intent={step.error.statusCode === 409 ? 'warning' : 'error'}>
            <MessageBarBody>
              <MessageBarTitle>{step.error.statusCode === 409 ? 'Import cancelled' : 'Nothing was imported'}</MessageBarTitle>
              {step.error.rowErrors?.length
                ? `${(step.error.rowErrorCount ?? step.error.rowErrors.length).toLocaleString('en-GB')} problem${(step.error.rowErrorCount ?? 0) === 1 ? '' : 's'} in the file's rows, listed below. Fix them in the file and choose it again, or import only the valid rows.`
                : step.error.message}
            </MessageBarBody>
          </MessageBar>
          {step.error.rowErrors && step.error.rowErrors.length > 0 && (
            <>
              <RowErrorsTable rowErrors={step.error.rowErrors} rowErrorCount={step.error.rowErrorCount ?? step.error.rowErrors.length} caption="Rows that cannot be read" />
              <div className={styles.actions}>
                <Button appearance="primary" onClick={() => send(step.file, step.preview, { ...step.fields, onRowErrors: 'skip' })}>
                  Import only the valid rows
                </Button>
                <Button onClick={() => setStep({ kind: 'map', file: step.file, preview: step.preview })}>Back to the columns</Button>
                <Caption1 className={styles.muted}>Or fix the file and choose it again.</Caption1>
              </div>
            </>
          )}
        </div>
      )}
    </div>
  );
}

function MappingStep({
  step,
  form,
  sites,
  onSubmit,
  busy,
}: {
  step: { file: File; preview: CsvPreview };
  form: ReturnType<typeof useForm<FormValues, unknown, z.output<typeof WeatherDatasetUploadSchema>>>;
  sites: readonly { id: string; name: string }[];
  onSubmit: () => void;
  busy: boolean;
}) {
  const styles = useStyles();
  const { control, formState } = form;
  const { preview } = step;
  const mapping = form.watch('mapping');
  const roleOf = useMemo(() => {
    const roles = new Map<string, string>();
    if (mapping?.timestampColumn) roles.set(mapping.timestampColumn, 'timestamp');
    if (mapping?.visibilityColumn) roles.set(mapping.visibilityColumn, `visibility${mapping.visibilityUnit ? ` (${mapping.visibilityUnit})` : ''}`);
    for (const field of OPTIONAL_FIELDS) if (mapping?.[field]) roles.set(mapping[field], WEATHER_OPTIONAL_COLUMNS[field].label.toLowerCase());
    return roles;
  }, [mapping]);
  // the preview rows read as the import will read them
  const previewProblems = useMemo(() => {
    const parsed = WeatherDatasetUploadSchema.shape.mapping.safeParse(withoutEmpty(mapping));
    if (!parsed.success) return null;
    const resolved = resolveWeatherColumns(preview.header, parsed.data);
    if (!('columns' in resolved)) return null;
    return preview.rows.flatMap((row) => {
      const read = readWeatherRow(row.cells, resolved.columns);
      return read.ok ? [] : read.errors.map((error) => `line ${row.line}${error.column ? `, ${error.column}` : ''}: ${error.message}`);
    });
  }, [mapping, preview]);

  const message = (field: FormField, error: { message?: string } | undefined) => (error?.message ? `${LABELS[field]} ${error.message}` : undefined);
  const columnSelect = (field: `mapping.${MappingField}`, optional: boolean) => (
    <Controller
      key={field}
      name={field}
      control={control}
      render={({ field: input, fieldState }) => (
        <Field label={LABELS[field]} required={!optional} validationMessage={message(field, fieldState.error)} validationState={fieldState.error ? 'error' : 'none'}>
          <Select value={input.value} onChange={(_, data) => input.onChange(data.value)} onBlur={input.onBlur} disabled={busy}>
            <option value="">{optional ? 'not in this file' : 'choose a column'}</option>
            {preview.header.map((name) => (
              <option key={name} value={name}>
                {name}
              </option>
            ))}
          </Select>
        </Field>
      )}
    />
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Columns of the weather file" className={styles.root} data-testid="weather-mapping">
      <div className={styles.intro}>
        <Subtitle2 as="h3">Which column is which</Subtitle2>
        <Body1 as="p" className={styles.muted} style={{ margin: 0 }}>
          {step.file.name}
          {preview.gzip ? ' (gzip)' : ''}: the first rows as read, with the columns guessed from their names and figures. Check the guess, the unit and the
          definition before you import. Timestamps are ISO 8601; one without a zone is read as UTC.
        </Body1>
      </div>
      {formState.errors.root && (
        <MessageBar intent="error">
          <MessageBarBody>{formState.errors.root.message}</MessageBarBody>
        </MessageBar>
      )}
      <div className={styles.preview} tabIndex={0} role="region" aria-label="First rows of the file">
        <Table size="extra-small" aria-label="First rows of the file" data-testid="weather-preview">
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Line</TableHeaderCell>
              {preview.header.map((name) => (
                <TableHeaderCell key={name}>
                  <span>
                    {name}
                    {roleOf.has(name) && (
                      <>
                        {' '}
                        <Badge appearance="tint" size="small">
                          {roleOf.get(name)}
                        </Badge>
                      </>
                    )}
                  </span>
                </TableHeaderCell>
              ))}
            </TableRow>
          </TableHeader>
          <TableBody>
            {preview.rows.map((row) => (
              <TableRow key={row.line}>
                <TableCell>{row.line}</TableCell>
                {preview.header.map((name, index) => (
                  <TableCell key={name} className={styles.cellNumber}>
                    {row.cells[index] ?? ''}
                  </TableCell>
                ))}
              </TableRow>
            ))}
          </TableBody>
        </Table>
      </div>
      {previewProblems && previewProblems.length > 0 && (
        <MessageBar intent="warning">
          <MessageBarBody>
            <MessageBarTitle>Some of the first rows cannot be read with these columns</MessageBarTitle>
            <ul className={styles.list}>
              {previewProblems.slice(0, 5).map((problem) => (
                <li key={problem}>{problem}</li>
              ))}
            </ul>
          </MessageBarBody>
        </MessageBar>
      )}
      <div className={styles.grid}>
        {columnSelect('mapping.timestampColumn', false)}
        {columnSelect('mapping.visibilityColumn', false)}
        <Controller
          name="mapping.visibilityUnit"
          control={control}
          render={({ field, fieldState }) => (
            <Field label={LABELS['mapping.visibilityUnit']} required validationMessage={message('mapping.visibilityUnit', fieldState.error)} validationState={fieldState.error ? 'error' : 'none'}>
              <Select value={field.value} onChange={(_, data) => field.onChange(data.value)} disabled={busy}>
                <option value="">choose a unit</option>
                {VISIBILITY_UNITS.map((unit) => (
                  <option key={unit} value={unit}>
                    {VISIBILITY_UNIT_LABELS[unit]}
                  </option>
                ))}
              </Select>
            </Field>
          )}
        />
        <Controller
          name="mapping.visibilityDefinition"
          control={control}
          render={({ field, fieldState }) => (
            <Field
              label={LABELS['mapping.visibilityDefinition']}
              required
              hint="Airport sensors, METAR and SYNOP report MOR (5 %)"
              validationMessage={message('mapping.visibilityDefinition', fieldState.error)}
              validationState={fieldState.error ? 'error' : 'none'}
            >
              <Select value={field.value} onChange={(_, data) => field.onChange(data.value)} disabled={busy}>
                <option value="">choose the definition</option>
                {VISIBILITY_DEFINITIONS.map((definition) => (
                  <option key={definition} value={definition}>
                    {SHORT_DEFINITION_LABELS[definition]}
                  </option>
                ))}
              </Select>
            </Field>
          )}
        />
        {OPTIONAL_FIELDS.map((field) => columnSelect(`mapping.${field}`, true))}
      </div>
      <div className={styles.grid}>
        <Controller
          name="name"
          control={control}
          render={({ field, fieldState }) => (
            <Field label={LABELS.name} required validationMessage={message('name', fieldState.error)} validationState={fieldState.error ? 'error' : 'none'}>
              <Input {...field} onChange={(_, data) => field.onChange(data.value)} maxLength={200} disabled={busy} />
            </Field>
          )}
        />
        <Controller
          name="siteId"
          control={control}
          render={({ field, fieldState }) => (
            <Field label={LABELS.siteId} validationMessage={message('siteId', fieldState.error)} validationState={fieldState.error ? 'error' : 'none'}>
              <Select value={field.value} onChange={(_, data) => field.onChange(data.value)} disabled={busy}>
                <option value="">not tied to a site</option>
                {sites.map((site) => (
                  <option key={site.id} value={site.id}>
                    {site.name}
                  </option>
                ))}
              </Select>
            </Field>
          )}
        />
      </div>
      <Controller
        name="onRowErrors"
        control={control}
        render={({ field }) => (
          <Field label={LABELS.onRowErrors}>
            <RadioGroup value={field.value} onChange={(_, data) => field.onChange(data.value)} disabled={busy}>
              <Radio value="reject" label="Import nothing and list them, so I can fix the file" />
              <Radio value="skip" label="Import the valid rows and list the others" />
            </RadioGroup>
          </Field>
        )}
      />
      <div className={styles.actions}>
        <Button type="submit" appearance="primary" disabled={busy}>
          Import the data set
        </Button>
      </div>
    </form>
  );
}

import { useMemo, useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Button, Caption1, Field, Input, MessageBar, MessageBarBody, Select, Text, Textarea, makeStyles, tokens } from '@fluentui/react-components';
import { VISIBILITY_DEFINITIONS, analyseClimatologyAvailability, type ClimatologyAnalysis, type LinkDesignInput } from '@beamwright/link-core';
import { CLIMATOLOGY_AVAILABILITY_METHOD, ClimatologyAvailabilityRequestSchema, VISIBILITY_DEFINITION_LABELS } from '@beamwright/link-core/contracts';
import { LazyEChart } from '@/components/charts/lazy-echart';
import { formatDb, formatDistance } from '@/lib/format';
import { useThemeMode } from '@/lib/theme';
import { availabilityRangeOption, availabilityRangeTable, percentText } from '@/features/weather/charts/availability-charts';
import { readClimatologyText } from '@/features/weather/climatology-text';
import { AvailabilityMethodNote } from '@/features/weather/components/availability-method-note';
import { ChartCard } from '@/components/charts/chart-card';
import { RangeTargets } from '@/features/weather/components/range-targets';

const useStyles = makeStyles({
  form: { display: 'grid', rowGap: tokens.spacingVerticalM, maxWidth: '760px' },
  row: { display: 'grid', gridTemplateColumns: 'repeat(auto-fit, minmax(min(180px, 100%), 1fr))', gap: tokens.spacingHorizontalM },
  table: { fontFamily: tokens.fontFamilyMonospace },
  results: { display: 'grid', rowGap: tokens.spacingVerticalM, minWidth: 0 },
  headline: { fontSize: tokens.fontSizeBase500, fontWeight: tokens.fontWeightSemibold },
  actions: { display: 'flex', columnGap: tokens.spacingHorizontalS, flexWrap: 'wrap' },
});

/** A synthetic example (the test table of reference case LB-03: not a real site), in km and %. */
const EXAMPLE_TABLE = ['0.05\t0.05', '0.1\t0.1', '0.2\t0.2', '0.5\t0.5', '1\t1', '2\t3', '5\t10', '10\t30'].join('\n');

const LABELS = { tableText: 'Cumulative table', requiredMarginDb: 'Required margin over the table' } as const;

const FormSchema = z
  .object({
    tableText: z.string(),
    visibilityUnit: z.enum(['m', 'km']),
    probabilityFormat: z.enum(['percent', 'fraction']),
    visibilityDefinition: z.enum(VISIBILITY_DEFINITIONS),
    requiredMarginText: z.string(),
  })
  .transform((values, context) => {
    const reading = readClimatologyText(values.tableText, values);
    if (!reading.ok) context.addIssue({ code: 'custom', path: ['tableText'], message: `${LABELS.tableText}: ${reading.message}` });
    const margin = ClimatologyAvailabilityRequestSchema.shape.requiredMarginDb.safeParse(values.requiredMarginText.trim() === '' ? undefined : Number(values.requiredMarginText));
    if (!margin.success) context.addIssue({ code: 'custom', path: ['requiredMarginText'], message: `${LABELS.requiredMarginDb} ${margin.error.issues[0]?.message ?? 'is not valid'}` });
    if (!reading.ok || !margin.success) return z.NEVER;
    return { climatology: reading.climatology, requiredMarginDb: margin.data };
  });
type FormValues = z.input<typeof FormSchema>;

/**
 * Availability from a cumulative visibility table typed or pasted by the engineer (when no records
 * exist): P(V < v) per level, computed in the browser with link-core, the same routine the api's
 * POST …/availability/climatology runs.
 */
export function ClimatologyAvailability({ design }: { design: LinkDesignInput }) {
  const styles = useStyles();
  const [mode] = useThemeMode();
  const [analysis, setAnalysis] = useState<{ result: ClimatologyAnalysis; requiredMarginDb: number } | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const form = useForm<FormValues, unknown, z.output<typeof FormSchema>>({
    defaultValues: { tableText: '', visibilityUnit: 'km', probabilityFormat: 'percent', visibilityDefinition: 'mor-5-percent', requiredMarginText: '0' },
    resolver: zodResolver(FormSchema),
    shouldFocusError: false,
  });
  const onSubmit = form.handleSubmit(({ climatology, requiredMarginDb }) => {
    try {
      setAnalysis({ result: analyseClimatologyAvailability(design, climatology, { requiredMarginDb }), requiredMarginDb });
      setFailure(null);
    } catch (error) {
      setAnalysis(null);
      setFailure(error instanceof Error ? error.message : 'The availability could not be computed.');
    }
  });
  const chart = useMemo(
    () =>
      analysis && {
        option: availabilityRangeOption(analysis.result.availabilityAgainstRange, analysis.result.rangesForAvailability, design.rangeM, mode),
        table: availabilityRangeTable(analysis.result.availabilityAgainstRange),
      },
    [analysis, design.rangeM, mode],
  );
  const totals = analysis?.result.totals;

  return (
    <div className={styles.results}>
      <form className={styles.form} onSubmit={onSubmit} noValidate aria-label="Availability from a cumulative table">
        <Caption1>
          One level per line: a visibility and the share of the time it is not reached, P(V &lt; visibility), e.g. from a weather service&apos;s
          visibility statistics. Separate the two numbers with a tab, a comma, a semicolon or spaces; a header line is skipped.
        </Caption1>
        <Controller
          name="tableText"
          control={form.control}
          render={({ field, fieldState }) => (
            <Field label={LABELS.tableText} required validationMessage={fieldState.error?.message} validationState={fieldState.error ? 'error' : 'none'}>
              <Textarea {...field} onChange={(_, data) => field.onChange(data.value)} className={styles.table} rows={8} resize="vertical" placeholder={'0.2\t0.2\n0.5\t0.5\n1\t1\n…'} />
            </Field>
          )}
        />
        <div className={styles.row}>
          <Controller
            name="visibilityUnit"
            control={form.control}
            render={({ field }) => (
              <Field label="Visibility in">
                <Select value={field.value} onChange={(_, data) => field.onChange(data.value)}>
                  <option value="km">kilometres</option>
                  <option value="m">metres</option>
                </Select>
              </Field>
            )}
          />
          <Controller
            name="probabilityFormat"
            control={form.control}
            render={({ field }) => (
              <Field label="P(V < visibility) as">
                <Select value={field.value} onChange={(_, data) => field.onChange(data.value)}>
                  <option value="percent">percent</option>
                  <option value="fraction">a fraction (0 … 1)</option>
                </Select>
              </Field>
            )}
          />
          <Controller
            name="visibilityDefinition"
            control={form.control}
            render={({ field }) => (
              <Field label="Visibility definition">
                <Select value={field.value} onChange={(_, data) => field.onChange(data.value)}>
                  {VISIBILITY_DEFINITIONS.map((definition) => (
                    <option key={definition} value={definition}>
                      {VISIBILITY_DEFINITION_LABELS[definition]}
                    </option>
                  ))}
                </Select>
              </Field>
            )}
          />
          <Controller
            name="requiredMarginText"
            control={form.control}
            render={({ field, fieldState }) => (
              <Field label={`${LABELS.requiredMarginDb} (dB)`} validationMessage={fieldState.error?.message} validationState={fieldState.error ? 'error' : 'none'}>
                <Input {...field} onChange={(_, data) => field.onChange(data.value)} inputMode="decimal" />
              </Field>
            )}
          />
        </div>
        <div className={styles.actions}>
          <Button type="submit" appearance="primary">
            Compute the availability
          </Button>
          <Button
            type="button"
            onClick={() => {
              form.setValue('tableText', EXAMPLE_TABLE);
              form.setValue('visibilityUnit', 'km');
              form.setValue('probabilityFormat', 'percent');
              form.setValue('visibilityDefinition', 'contrast-2-percent');
            }}
          >
            Fill in a synthetic example
          </Button>
        </div>
      </form>
      {failure && (
        <MessageBar intent="error">
          <MessageBarBody>{failure}</MessageBarBody>
        </MessageBar>
      )}
      {analysis && totals && chart && (
        <div className={styles.results} data-testid="climatology-results">
          <div aria-live="polite">
            <Text className={styles.headline} data-testid="climatology-headline">
              Availability {percentText(totals.availability)}
            </Text>{' '}
            <Caption1>
              ({totals.outageHoursPerYear.toFixed(1)} h a year down; fails below a visibility of{' '}
              {totals.minimumVisibilityM === null ? 'any visibility' : formatDistance(totals.minimumVisibilityM)}; clear-air margin {formatDb(totals.clearAirMarginDb)}
              {totals.lookup === 'below-table' ? '; V_min lies below the first level of the table, so its first segment was extended' : ''}
              {totals.lookup === 'above-table' ? '; V_min lies above the last level of the table' : ''})
            </Caption1>
          </div>
          <RangeTargets ranges={analysis.result.rangesForAvailability} visibilityLabel="Deciding visibility" testId="climatology-ranges" />
          <ChartCard title="Availability against path length (table)" caption="From the table, everything but the path length as designed; dashed lines: the target availabilities." data={chart.table} testId="chart-climatology-range">
            <LazyEChart option={chart.option} ariaLabel="Availability from the table, in percent, against path length in kilometres" testId="chart-climatology-range" />
          </ChartCard>
          <AvailabilityMethodNote method={CLIMATOLOGY_AVAILABILITY_METHOD} />
        </div>
      )}
    </div>
  );
}

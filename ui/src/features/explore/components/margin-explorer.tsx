import { useMemo } from 'react';
import { Controller, useForm, useWatch, type Control } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Caption1, Field, Input, Radio, RadioGroup, Select, Spinner, Subtitle2, makeStyles, tokens } from '@fluentui/react-components';
import type { LinkDesignInput } from '@beamwright/link-core';
import { ChartCard } from '@/components/charts/chart-card';
import { LazyEChart } from '@/components/charts/lazy-echart';
import { useThemeMode } from '@/lib/theme';
import { EXPLORE_FIELDS, EXPLORE_FIELD_IDS, designValueSi, type ExploreFieldId } from '@/features/explore/explore-fields';
import {
  EXPLORE_LABELS,
  axisForField,
  defaultExploreSettings,
  exploreSettingsSchema,
  toSweepAxis,
  type ExploreSettings,
  type ExploreSettingsText,
} from '@/features/explore/explore-settings';
import { useSweep, type SweepRequest } from '@/features/explore/hooks/use-sweep';
import { sweepData, sweepOption } from '@/features/explore/charts/sweep-chart';
import { heatMapData, heatMapOption } from '@/features/explore/charts/heat-map-chart';

const useStyles = makeStyles({
  root: { display: 'grid', rowGap: tokens.spacingVerticalM, minWidth: 0 },
  settings: {
    display: 'grid',
    rowGap: tokens.spacingVerticalS,
    padding: tokens.spacingHorizontalM,
    backgroundColor: tokens.colorNeutralBackground1,
    border: `1px solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusLarge,
  },
  axisRow: { display: 'grid', gridTemplateColumns: 'repeat(auto-fit, minmax(min(120px, 100%), 1fr))', gap: tokens.spacingHorizontalS, alignItems: 'start' },
  wide: { gridColumn: 'span 2', '@media (max-width: 520px)': { gridColumn: 'auto' } },
  muted: { color: tokens.colorNeutralForeground3 },
  status: { display: 'flex', alignItems: 'center', columnGap: tokens.spacingHorizontalS, minHeight: '24px' },
});

type AxisName = 'x' | 'y';

/** "<label> <reason>", as every form of the app words its messages. */
const worded = (path: string, reason: string | undefined) => (reason ? `${EXPLORE_LABELS[path] ?? path} ${reason}` : undefined);

function AxisFields({ name, control, design, onFieldChange }: { name: AxisName; control: Control<ExploreSettingsText, unknown, ExploreSettings>; design: LinkDesignInput; onFieldChange: (field: ExploreFieldId) => void }) {
  const styles = useStyles();
  const field = useWatch({ control, name: `${name}.field` });
  const unit = EXPLORE_FIELDS[field].unit;
  const designValue = designValueSi(design, field) / EXPLORE_FIELDS[field].factor;
  return (
    <div className={styles.axisRow} role="group" aria-label={name === 'x' ? 'Horizontal input' : 'Vertical input'}>
      <Controller
        name={`${name}.field`}
        control={control}
        render={({ field: input, fieldState }) => (
          <Field
            className={styles.wide}
            label={EXPLORE_LABELS[`${name}.field`]}
            hint={`This design: ${Number(designValue.toPrecision(4))} ${unit}`}
            validationMessage={worded(`${name}.field`, fieldState.error?.message)}
            validationState={fieldState.error ? 'error' : 'none'}
          >
            <Select value={input.value} onChange={(_, data) => onFieldChange(data.value as ExploreFieldId)} data-testid={`explore-${name}-field`}>
              {EXPLORE_FIELD_IDS.map((id) => (
                <option key={id} value={id}>
                  {EXPLORE_FIELDS[id].label}
                </option>
              ))}
            </Select>
          </Field>
        )}
      />
      {(['from', 'to'] as const).map((end) => (
        <Controller
          key={end}
          name={`${name}.${end}`}
          control={control}
          render={({ field: input, fieldState }) => (
            <Field label={`${EXPLORE_LABELS[`${name}.${end}`]} (${unit})`} validationMessage={worded(`${name}.${end}`, fieldState.error?.message)} validationState={fieldState.error ? 'error' : 'none'}>
              <Input {...input} inputMode="decimal" onChange={(_, data) => input.onChange(data.value)} data-testid={`explore-${name}-${end}`} />
            </Field>
          )}
        />
      ))}
      <Controller
        name={`${name}.points`}
        control={control}
        render={({ field: input, fieldState }) => (
          <Field label={EXPLORE_LABELS[`${name}.points`]} validationMessage={worded(`${name}.points`, fieldState.error?.message)} validationState={fieldState.error ? 'error' : 'none'}>
            <Input {...input} inputMode="numeric" onChange={(_, data) => input.onChange(data.value)} data-testid={`explore-${name}-points`} />
          </Field>
        )}
      />
      <Controller
        name={`${name}.spacing`}
        control={control}
        render={({ field: input }) => (
          <Field label="Spacing">
            <Select value={input.value} onChange={(_, data) => input.onChange(data.value)} data-testid={`explore-${name}-spacing`}>
              <option value="linear">Even steps</option>
              <option value="log">Logarithmic</option>
            </Select>
          </Field>
        )}
      />
    </div>
  );
}

export interface MarginExplorerProps {
  /** the design explored (the workspace passes a lagging copy, so typing never waits) */
  design: LinkDesignInput;
  requiredMarginDb: number;
}

/**
 * Margin against one input (a line) or two (a heat map with the 0 dB and required-margin contours),
 * everything else as designed. The budgets run in a worker; the last result stays on screen while
 * the next computes.
 */
export function MarginExplorer({ design, requiredMarginDb }: MarginExplorerProps) {
  const styles = useStyles();
  const [mode] = useThemeMode();
  const form = useForm<ExploreSettingsText, unknown, ExploreSettings>({
    defaultValues: defaultExploreSettings(design),
    resolver: zodResolver(exploreSettingsSchema),
    mode: 'onChange',
    shouldFocusError: false,
  });
  const values = useWatch({ control: form.control });
  const parsed = exploreSettingsSchema.safeParse(values);
  const settings = parsed.success ? parsed.data : null;
  const settingsKey = settings ? JSON.stringify(settings) : null;

  const request = useMemo<SweepRequest | null>(() => {
    if (!settings) return null;
    return settings.mode === 'line' ? { kind: 'line', design, axis: toSweepAxis(settings.x) } : { kind: 'grid', design, xAxis: toSweepAxis(settings.x), yAxis: toSweepAxis(settings.y) };
    // settingsKey stands for settings: a new object each render with the same content must not re-run
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [design, settingsKey]);
  const sweep = useSweep(request);

  const shown = useMemo(() => {
    const { result, resultRequest } = sweep;
    if (!result || !resultRequest) return null;
    if (result.kind === 'line' && resultRequest.kind === 'line') {
      const input = { axis: resultRequest.axis, result, designValueSi: designValueSi(resultRequest.design, resultRequest.axis.field), requiredMarginDb };
      return { kind: 'line' as const, option: sweepOption(input, mode), data: sweepData(input), count: result.xSi.length, computeMs: result.computeMs, label: EXPLORE_FIELDS[resultRequest.axis.field].label };
    }
    if (result.kind === 'grid' && resultRequest.kind === 'grid') {
      const input = {
        xAxis: resultRequest.xAxis,
        yAxis: resultRequest.yAxis,
        result,
        designXSi: designValueSi(resultRequest.design, resultRequest.xAxis.field),
        designYSi: designValueSi(resultRequest.design, resultRequest.yAxis.field),
        requiredMarginDb,
      };
      return {
        kind: 'grid' as const,
        option: heatMapOption(input, mode),
        data: heatMapData(input),
        count: result.marginDb.length,
        computeMs: result.computeMs,
        label: `${EXPLORE_FIELDS[resultRequest.xAxis.field].label} × ${EXPLORE_FIELDS[resultRequest.yAxis.field].label}`,
      };
    }
    return null;
  }, [sweep, mode, requiredMarginDb]);

  const changeField = (axis: AxisName, field: ExploreFieldId) => {
    const points = form.getValues(`${axis}.points`);
    form.setValue(axis, axisForField(design, field, points), { shouldValidate: true, shouldDirty: true });
  };

  const isGrid = values.mode === 'grid';
  const title = shown?.kind === 'grid' ? `Margin over ${shown.label}` : shown ? `Margin against ${shown.label.toLowerCase()}` : 'Margin explorer';

  return (
    <div className={styles.root}>
      <form className={styles.settings} aria-label="What to explore" noValidate onSubmit={(event) => event.preventDefault()}>
        <Subtitle2 as="h3">Explore the margin</Subtitle2>
        <Caption1 className={styles.muted}>
          Every point is a full budget of this design with the chosen input{isGrid ? 's' : ''} changed and everything else as designed.
        </Caption1>
        <Controller
          name="mode"
          control={form.control}
          render={({ field }) => (
            <RadioGroup
              layout="horizontal"
              value={field.value}
              onChange={(_, data) => {
                // a line's fine sampling would make a slow heat map: start the grid coarser
                if (data.value === 'grid' && Number(form.getValues('x.points')) > 80) form.setValue('x.points', '60', { shouldValidate: true });
                field.onChange(data.value);
              }}
              aria-label="Plot"
            >
              <Radio value="line" label="Along one input" data-testid="explore-mode-line" />
              <Radio value="grid" label="Over two inputs (heat map)" data-testid="explore-mode-grid" />
            </RadioGroup>
          )}
        />
        <AxisFields name="x" control={form.control} design={design} onFieldChange={(field) => changeField('x', field)} />
        {isGrid && <AxisFields name="y" control={form.control} design={design} onFieldChange={(field) => changeField('y', field)} />}
      </form>

      <div className={styles.status} aria-live="polite" data-testid="explore-status">
        {sweep.computing && <Spinner size="extra-tiny" aria-hidden />}
        <Caption1 className={styles.muted}>
          {sweep.error
            ? `The sweep failed: ${sweep.error}`
            : sweep.computing
              ? shown
                ? 'Computing the new sweep; the chart shows the previous one.'
                : 'Computing…'
              : shown
                ? `${shown.count.toLocaleString('en')} budgets in ${shown.computeMs.toFixed(0)} ms.`
                : settings
                  ? ''
                  : 'Fix the highlighted settings to draw the chart.'}
        </Caption1>
      </div>

      {shown && (
        <div data-testid="explore-result" data-kind={shown.kind} data-count={shown.count} data-computing={sweep.computing ? 'true' : 'false'} data-serial={sweep.serial}>
          <ChartCard
            title={title}
            caption={
              shown.kind === 'grid'
                ? `Colour: link margin in dB, red where the link fails, blue where it closes. Solid line: 0 dB; dashed line: the required ${requiredMarginDb} dB. The diamond is this design.`
                : `Shaded: where the link fails (below 0 dB). Dashed: the required ${requiredMarginDb} dB. The vertical line is this design.`
            }
            data={shown.data}
            testId="chart-explore"
          >
            <LazyEChart option={shown.option} ariaLabel={title} height={shown.kind === 'grid' ? 360 : 280} testId="chart-explore" />
          </ChartCard>
        </div>
      )}
    </div>
  );
}

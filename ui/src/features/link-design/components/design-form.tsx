import { Fragment, memo, type ReactNode } from 'react';
import {
  Caption1,
  Field,
  Select,
  Subtitle2,
  Switch,
  makeStyles,
  mergeClasses,
  tokens,
} from '@fluentui/react-components';
import { ATMOSPHERE_MODELS } from '@beamwright/link-core';
import {
  ATMOSPHERE_MODEL_LABELS,
  QUANTITY_FIELDS,
  SECTION_TITLES,
  TURBULENCE_MODEL_LABELS,
  VISIBILITY_DEFINITION_LABELS,
  fieldsOfSection,
  type DesignSection,
  type QuantityFieldId,
} from '@/features/link-design/design-fields';
import type { AngleExtent, DesignDraft, WidthExtent } from '@/features/link-design/design-draft';
import { formatAngle, formatLength } from '@/lib/format';
import { DefinitionSelect, QuantityInput } from '@/features/link-design/components/quantity-input';

const useStyles = makeStyles({
  form: { display: 'grid', rowGap: tokens.spacingVerticalL },
  section: {
    display: 'grid',
    rowGap: tokens.spacingVerticalM,
    padding: tokens.spacingHorizontalL,
    borderRadius: tokens.borderRadiusLarge,
    backgroundColor: tokens.colorNeutralBackground1,
    border: `1px solid ${tokens.colorNeutralStroke2}`,
  },
  sectionTitle: {
    display: 'flex',
    alignItems: 'center',
    columnGap: tokens.spacingHorizontalS,
    color: tokens.colorNeutralForeground2,
    textTransform: 'uppercase',
    letterSpacing: '0.06em',
    fontSize: tokens.fontSizeBase200,
  },
  grid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(200px, 1fr))',
    columnGap: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalM,
    alignItems: 'start',
  },
  wide: { gridColumn: '1 / -1' },
  note: { color: tokens.colorNeutralForeground3 },
});

export interface DesignFormProps {
  draft: DesignDraft;
  errors: Partial<Record<string, string>>;
  changedFieldIds: readonly string[];
  onTextChange: (id: QuantityFieldId, text: string) => void;
  onUpdate: (changes: Partial<Omit<DesignDraft, 'text'>>) => void;
  /** values the budget uses after conversion, shown beside fields typed in another definition */
  resolved: { waistRadiusM?: number; halfAngleDivergenceRad?: number; diffractionHalfAngleRad?: number };
  /** a line shown under the transmit power field (the eye-safety indication) */
  powerNote?: ReactNode;
  /** shown at the top of the transmitter and receiver sections (the catalogue pickers) */
  transmitterExtras?: ReactNode;
  receiverExtras?: ReactNode;
  /** shown under the path length (what the two sites say) */
  pathExtras?: ReactNode;
  /** an action under a field, across the section (the "size it for me" solvers) */
  fieldActions?: Partial<Record<QuantityFieldId, ReactNode>>;
}

function DesignFormView({ draft, errors, changedFieldIds, onTextChange, onUpdate, resolved, powerNote, transmitterExtras, receiverExtras, pathExtras, fieldActions }: DesignFormProps) {
  const styles = useStyles();
  const changed = (id: string) => changedFieldIds.includes(id);
  const input = (id: QuantityFieldId, props: { extra?: ReactNode; hint?: ReactNode; wide?: boolean } = {}) => (
    <Fragment key={id}>
      <QuantityInput
        id={id}
        draft={draft}
        errors={errors}
        changed={changed(id)}
        onTextChange={onTextChange}
        extra={props.extra}
        hint={props.hint}
        className={props.wide ? styles.wide : undefined}
      />
      {fieldActions?.[id] && <div className={styles.wide}>{fieldActions[id]}</div>}
    </Fragment>
  );

  const beamSizeConverted = draft.beamSize.extent !== 'radius' || draft.beamSize.definition !== '1/e2';
  const divergenceConverted = draft.divergence.extent !== 'half' || draft.divergence.definition !== '1/e2';

  const section = (key: DesignSection, children: ReactNode) => (
    <section className={styles.section} aria-labelledby={`section-${key}`}>
      <Subtitle2 as="h3" id={`section-${key}`} className={styles.sectionTitle}>
        {SECTION_TITLES[key]}
      </Subtitle2>
      <div className={styles.grid}>{children}</div>
    </section>
  );

  return (
    <form className={styles.form} onSubmit={(event) => event.preventDefault()} aria-label="Link design" noValidate>
      {section(
        'path',
        <>
          {fieldsOfSection('path').map((field) => input(field.id))}
          {pathExtras && <div className={styles.wide}>{pathExtras}</div>}
        </>,
      )}

      {section(
        'transmitter',
        <>
          {transmitterExtras && <div className={styles.wide}>{transmitterExtras}</div>}
          {input('transmitter.wavelengthM')}
          {input('transmitter.powerDbm', { hint: powerNote, wide: true })}
          {input('transmitter.waistRadiusM', {
            wide: true,
            extra: (
              <>
                <Select
                  value={draft.beamSize.extent}
                  onChange={(_, data) => onUpdate({ beamSize: { ...draft.beamSize, extent: data.value as WidthExtent } })}
                  aria-label="Beam size is a radius or a diameter"
                >
                  <option value="radius">radius</option>
                  <option value="diameter">diameter</option>
                </Select>
                <DefinitionSelect
                  label="Beam size definition"
                  value={draft.beamSize.definition}
                  onChange={(definition) => onUpdate({ beamSize: { ...draft.beamSize, definition } })}
                />
              </>
            ),
            hint:
              beamSizeConverted && resolved.waistRadiusM !== undefined
                ? `Budget uses a 1/e² radius of ${formatLength(resolved.waistRadiusM)}.`
                : 'The 1/e² radius W0 at the exit aperture; pick the definition your datasheet uses.',
          })}
          {input('transmitter.halfAngleDivergenceRad', {
            wide: true,
            extra: (
              <>
                <Select
                  value={draft.divergence.extent}
                  onChange={(_, data) => onUpdate({ divergence: { ...draft.divergence, extent: data.value as AngleExtent } })}
                  aria-label="Divergence is a half or a full angle"
                >
                  <option value="half">half angle</option>
                  <option value="full">full angle</option>
                </Select>
                <DefinitionSelect
                  label="Divergence definition"
                  value={draft.divergence.definition}
                  onChange={(definition) => onUpdate({ divergence: { ...draft.divergence, definition } })}
                />
              </>
            ),
            hint:
              (divergenceConverted && resolved.halfAngleDivergenceRad !== undefined
                ? `Budget uses a 1/e² half angle of ${formatAngle(resolved.halfAngleDivergenceRad)}. `
                : '') +
              (resolved.diffractionHalfAngleRad !== undefined
                ? `Diffraction limit for this beam: ${formatAngle(resolved.diffractionHalfAngleRad)} (1/e² half angle). Blank = collimated.`
                : 'Blank = collimated, diffraction-limited beam.'),
          })}
          {input('transmitter.m2')}
          {input('transmitter.opticsLossDb')}
        </>,
      )}

      {section(
        'receiver',
        <>
          {receiverExtras && <div className={styles.wide}>{receiverExtras}</div>}
          {fieldsOfSection('receiver').map((field) => input(field.id))}
        </>,
      )}
      {section('pointing', fieldsOfSection('pointing').map((field) => input(field.id)))}

      {section(
        'atmosphere',
        <>
          <Field label="Visibility model" hint="Kim is the default; the Al Naboulsi models describe a known fog type.">
            <Select value={draft.atmosphereModel} onChange={(_, data) => onUpdate({ atmosphereModel: data.value })} name="atmosphere.model">
              {ATMOSPHERE_MODELS.map((value) => (
                <option key={value} value={value}>
                  {ATMOSPHERE_MODEL_LABELS[value] ?? value}
                </option>
              ))}
            </Select>
          </Field>
          {input('atmosphere.visibilityM')}
          <Field label="Visibility is given as" hint="Airport reports (METAR/SYNOP) give MOR; it is converted before use.">
            <Select
              value={draft.visibilityDefinition}
              onChange={(_, data) => onUpdate({ visibilityDefinition: data.value })}
              name="atmosphere.visibilityDefinition"
            >
              {Object.entries(VISIBILITY_DEFINITION_LABELS).map(([value, label]) => (
                <option key={value} value={value}>
                  {label}
                </option>
              ))}
            </Select>
          </Field>
          {input('atmosphere.cn2')}
          <Field
            label="Turbulence model"
            hint="The Gaussian beam follows the launched beam: turbulence widens it (a beam-spread row) and moves it; the spherical wave suits strongly divergent beams."
          >
            <Select value={draft.turbulenceModel || 'gaussian-beam'} onChange={(_, data) => onUpdate({ turbulenceModel: data.value })} name="atmosphere.turbulenceModel">
              {Object.entries(TURBULENCE_MODEL_LABELS).map(([value, label]) => (
                <option key={value} value={value}>
                  {label}
                </option>
              ))}
            </Select>
          </Field>
          <Field label="Scintillation fade margin" hint="Gamma-gamma fade margin of the chosen turbulence model, aperture averaged.">
            <Switch
              checked={draft.scintillationInclude}
              onChange={(_, data) => onUpdate({ scintillationInclude: data.checked })}
              label={draft.scintillationInclude ? 'Subtracted from the margin' : 'Left out'}
              name="scintillation.include"
            />
          </Field>
          {draft.scintillationInclude && input('scintillation.probability')}
        </>,
      )}

      {section('allowances', fieldsOfSection('allowances').map((field) => input(field.id)))}
      {Object.keys(errors).some((path) => !(path in QUANTITY_FIELDS) && !path.startsWith('atmosphere.') && path !== 'scintillation.include') && (
        <Caption1 className={mergeClasses(styles.note)} role="alert">
          {Object.entries(errors)
            .filter(([path]) => !(path in QUANTITY_FIELDS))
            .map(([, message]) => message)
            .join(' ')}
        </Caption1>
      )}
    </form>
  );
}

export const DesignForm = memo(DesignFormView);

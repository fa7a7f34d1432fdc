import type { ReactNode } from 'react';
import { Field, Input, Select, Tooltip, makeStyles, mergeClasses, tokens } from '@fluentui/react-components';
import { CircleSmallFilled } from '@fluentui/react-icons';
import { QUANTITY_FIELDS, WIDTH_DEFINITIONS, WIDTH_DEFINITION_LABELS, type QuantityFieldId, type WidthDefinition } from '@/features/link-design/design-fields';
import type { DesignDraft } from '@/features/link-design/design-draft';

const useStyles = makeStyles({
  // value, then its definition pickers; they wrap under the value when the column is narrow
  row: { display: 'flex', flexWrap: 'wrap', columnGap: tokens.spacingHorizontalS, rowGap: tokens.spacingVerticalXS },
  input: { fontVariantNumeric: 'tabular-nums' },
  rowInput: { flexGrow: 1, flexBasis: '110px', minWidth: 0 },
  edited: { color: tokens.colorPaletteMarigoldForeground1, verticalAlign: 'middle' },
});

function EditedMark({ show }: { show: boolean }) {
  const styles = useStyles();
  if (!show) return null;
  return (
    <Tooltip content="Changed since the stored revision" relationship="label">
      <CircleSmallFilled className={styles.edited} />
    </Tooltip>
  );
}

/** One quantity typed with its unit, its message beside it and a mark when it differs from the stored revision. */
export function QuantityInput({
  id,
  draft,
  errors,
  changed,
  onTextChange,
  extra,
  hint,
  className,
}: {
  id: QuantityFieldId;
  draft: DesignDraft;
  errors: Partial<Record<string, string>>;
  changed: boolean;
  onTextChange: (id: QuantityFieldId, text: string) => void;
  extra?: ReactNode;
  hint?: ReactNode;
  className?: string;
}) {
  const styles = useStyles();
  const field = QUANTITY_FIELDS[id];
  const error = errors[id];
  const input = (
    <Input
      className={mergeClasses(styles.input, extra ? styles.rowInput : undefined)}
      name={id}
      value={draft.text[id]}
      placeholder={`e.g. ${field.example}`}
      onChange={(_, data) => onTextChange(id, data.value)}
      autoComplete="off"
      spellCheck={false}
      aria-describedby={undefined}
    />
  );
  return (
    <Field
      className={className}
      label={
        <>
          {field.label} <EditedMark show={changed} />
        </>
      }
      required={!field.optional}
      validationState={error ? 'error' : 'none'}
      validationMessage={error}
      hint={(hint ?? field.hint ?? (field.optional ? `Optional. e.g. ${field.example}` : `e.g. ${field.example}`)) as string}
      data-field={id}
    >
      {extra ? (
        <div className={styles.row}>
          {input}
          {extra}
        </div>
      ) : (
        input
      )}
    </Field>
  );
}

/** The datasheet's width definition (1/e², 1/e, FWHM) of a beam size or angle. */
export function DefinitionSelect({ value, onChange, label }: { value: WidthDefinition; onChange: (value: WidthDefinition) => void; label: string }) {
  return (
    <Select value={value} onChange={(_, data) => onChange(data.value as WidthDefinition)} aria-label={label}>
      {WIDTH_DEFINITIONS.map((definition) => (
        <option key={definition} value={definition}>
          {WIDTH_DEFINITION_LABELS[definition].split(' ')[0]}
        </option>
      ))}
    </Select>
  );
}

import { useMemo } from 'react';
import {
  Body1,
  Button,
  Caption1,
  Field,
  Input,
  Menu,
  MenuItem,
  MenuList,
  MenuPopover,
  MenuTrigger,
  MessageBar,
  MessageBarBody,
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
import { AddRegular, ArrowSwapRegular, ArrowUpload16Regular, DeleteRegular, TextBulletListSquareRegular } from '@fluentui/react-icons';
import { USUAL_FSO_WAVELENGTHS_M, type LinkDesignInput } from '@beamwright/link-core';
import { MAX_VARIANTS_PER_REVISION } from '@beamwright/link-core/contracts';
import { ComparisonTable } from '@/features/variants/components/comparison-table';
import { WavelengthComparisonView } from '@/features/variants/components/wavelength-comparison';
import { compareDesigns } from '@/features/variants/variant-comparison';
import { wavelengthLabel, wavelengthSet } from '@/features/variants/wavelength-set';
import type { VariantDraft, VariantSet } from '@/features/variants/hooks/use-variant-set';

const useStyles = makeStyles({
  root: { display: 'grid', rowGap: tokens.spacingVerticalL, minWidth: 0 },
  card: {
    display: 'grid',
    rowGap: tokens.spacingVerticalS,
    padding: tokens.spacingHorizontalM,
    backgroundColor: tokens.colorNeutralBackground1,
    border: `1px solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusLarge,
    minWidth: 0,
  },
  actions: { display: 'flex', flexWrap: 'wrap', columnGap: tokens.spacingHorizontalS, rowGap: tokens.spacingVerticalS },
  rowActions: { display: 'flex', flexWrap: 'wrap', columnGap: tokens.spacingHorizontalXS, rowGap: tokens.spacingVerticalXS },
  muted: { color: tokens.colorNeutralForeground3 },
  number: { textAlign: 'end', fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap' },
  scroll: { overflowX: 'auto' },
});

export interface AlternativesPanelProps {
  /** the design in the form (or the stored one, read-only) */
  primaryDesign: LinkDesignInput;
  primaryLabel: string;
  requiredMarginDb: number;
  /** the variants shown (stored ones when read-only) */
  variants: readonly Pick<VariantDraft, 'id' | 'name' | 'design'>[];
  /** editing: the working list, the server's messages per variant position, and the swap into the form */
  edit?: {
    set: VariantSet;
    errors: Partial<Record<number, string>>;
    onUseInForm: (variant: VariantDraft) => void;
    /** distinct wavelengths of the transmitters in the catalogue [m] */
    catalogueWavelengthsM: number[];
  };
  /** promotion of a stored variant to the next revision (engineers, while nothing is unsaved) */
  promote?: {
    revision: number;
    /** why promotion is not offered now (unsaved changes…); null when it is */
    unavailableReason: string | null;
    pendingIndex: number | null;
    error: string | null;
    onPromote: (index: number) => void;
  };
}

const marginOf = (rows: ReturnType<typeof compareDesigns>, column: number) => rows.find((row) => row.key === 'margin')?.values[column];

export function AlternativesPanel({ primaryDesign, primaryLabel, requiredMarginDb, variants, edit, promote }: AlternativesPanelProps) {
  const styles = useStyles();
  const rows = useMemo(
    () => compareDesigns([{ name: primaryLabel, design: primaryDesign }, ...variants.map(({ name, design }) => ({ name, design }))], requiredMarginDb),
    [primaryDesign, primaryLabel, variants, requiredMarginDb],
  );
  const full = variants.length >= MAX_VARIANTS_PER_REVISION;
  const catalogue = edit?.catalogueWavelengthsM ?? [];

  return (
    <div className={styles.root}>
      <section className={styles.card} aria-label="Alternatives">
        <Subtitle2 as="h3">Alternatives</Subtitle2>
        <Caption1 className={styles.muted}>
          Named alternatives are saved with the revision, each with its own budget, so a reviewer sees what was considered beside what was chosen (at most{' '}
          {MAX_VARIANTS_PER_REVISION}).
        </Caption1>
        {edit && (
          <div className={styles.actions}>
            <Button icon={<AddRegular />} disabled={full} onClick={() => edit.set.add(`${wavelengthLabel(primaryDesign.transmitter.wavelengthM)}, ${primaryDesign.transmitter.powerDbm} dBm`, primaryDesign)} data-testid="variant-keep">
              Keep this design as an alternative
            </Button>
            <Menu>
              <MenuTrigger disableButtonEnhancement>
                <Button icon={<TextBulletListSquareRegular />} disabled={full} data-testid="variant-wavelength-set">
                  Add a wavelength set
                </Button>
              </MenuTrigger>
              <MenuPopover>
                <MenuList>
                  <MenuItem onClick={() => edit.set.addMany(wavelengthSet(primaryDesign))} data-testid="variant-wavelength-usual">
                    The usual four: {USUAL_FSO_WAVELENGTHS_M.map(wavelengthLabel).join(', ')}
                  </MenuItem>
                  <MenuItem disabled={catalogue.length === 0} onClick={() => edit.set.addMany(wavelengthSet(primaryDesign, catalogue))}>
                    {catalogue.length > 0 ? `The catalogue's: ${catalogue.map(wavelengthLabel).join(', ')}` : 'The catalogue has no transmitters'}
                  </MenuItem>
                </MenuList>
              </MenuPopover>
            </Menu>
          </div>
        )}
        {promote?.error && (
          <MessageBar intent="error">
            <MessageBarBody>{promote.error}</MessageBarBody>
          </MessageBar>
        )}
        {variants.length === 0 ? (
          <Body1 className={styles.muted}>{edit ? 'No alternatives yet: keep this design, or add a wavelength set, then change the design in the form.' : 'This revision carries no alternatives.'}</Body1>
        ) : (
          <div className={styles.scroll}>
            <Table size="small" aria-label="Alternatives of the design" data-testid="variant-list">
              <TableHeader>
                <TableRow>
                  <TableHeaderCell>Name</TableHeaderCell>
                  <TableHeaderCell className={styles.number}>Wavelength</TableHeaderCell>
                  <TableHeaderCell className={styles.number}>Margin</TableHeaderCell>
                  <TableHeaderCell>Actions</TableHeaderCell>
                </TableRow>
              </TableHeader>
              <TableBody>
                {variants.map((variant, index) => {
                  const margin = marginOf(rows, index + 1);
                  const error = edit?.errors[index];
                  return (
                    <TableRow key={variant.id} data-testid="variant-row">
                      <TableCell>
                        {edit ? (
                          <Field validationMessage={error} validationState={error ? 'error' : 'none'}>
                            <Input aria-label={`Name of alternative ${index + 1}`} value={variant.name} maxLength={100} onChange={(_, data) => edit.set.rename(variant.id, data.value)} />
                          </Field>
                        ) : (
                          variant.name
                        )}
                      </TableCell>
                      <TableCell className={styles.number}>{wavelengthLabel(variant.design.transmitter.wavelengthM)}</TableCell>
                      <TableCell className={styles.number}>{typeof margin === 'number' ? `${margin.toFixed(2).replace('-', '\u2212')} dB` : '—'}</TableCell>
                      <TableCell>
                        <div className={styles.rowActions}>
                          {edit && (
                            <>
                              <Button size="small" icon={<ArrowSwapRegular />} onClick={() => edit.onUseInForm(variant as VariantDraft)} aria-label={`Put ${variant.name} in the form; the form's design takes its place`}>
                                Swap into the form
                              </Button>
                              <Button size="small" icon={<DeleteRegular />} onClick={() => edit.set.remove(variant.id)} aria-label={`Remove ${variant.name}`}>
                                Remove
                              </Button>
                            </>
                          )}
                          {promote && (
                            <Button
                              size="small"
                              appearance="primary"
                              icon={<ArrowUpload16Regular />}
                              disabledFocusable={promote.unavailableReason !== null || promote.pendingIndex !== null}
                              title={promote.unavailableReason ?? undefined}
                              onClick={() => promote.onPromote(index)}
                              aria-label={`Make ${variant.name} the design of revision ${promote.revision + 1}`}
                              data-testid="variant-promote"
                            >
                              {promote.pendingIndex === index ? 'Promoting…' : `Make it revision ${promote.revision + 1}`}
                            </Button>
                          )}
                        </div>
                      </TableCell>
                    </TableRow>
                  );
                })}
              </TableBody>
            </Table>
          </div>
        )}
        {promote?.unavailableReason && variants.length > 0 && <Caption1 className={styles.muted}>{promote.unavailableReason}</Caption1>}
      </section>

      {variants.length > 0 && (
        <section className={styles.card} aria-label="Side by side">
          <Subtitle2 as="h3">Side by side</Subtitle2>
          <Caption1 className={styles.muted}>
            Every figure is link-core's budget of each design. Tinted, dotted: differs from {primaryLabel.toLowerCase()}; star: the best of the row. Eye-safety figures are
            indicative only: the applicable laser-safety standard, local rules and a qualified laser safety officer decide.
          </Caption1>
          <ComparisonTable columns={[primaryLabel, ...variants.map((variant) => variant.name)]} rows={rows} testId="variant-comparison" />
        </section>
      )}

      <section className={styles.card}>
        <WavelengthComparisonView design={primaryDesign} requiredMarginDb={requiredMarginDb} />
      </section>
    </div>
  );
}

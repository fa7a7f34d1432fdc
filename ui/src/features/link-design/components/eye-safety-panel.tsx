import { useMemo } from 'react';
import {
  Badge,
  Caption1,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableRow,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { EyeTrackingRegular, ShieldCheckmarkRegular, WarningRegular } from '@fluentui/react-icons';
import { assessEyeSafety, eyeSafetyInputOf, type EyeSafetyAssessment, type LinkBudget, type LinkDesignInput } from '@beamwright/link-core';
import { formatDistance, formatPowerW } from '@/lib/format';

/** Our own short caution for places where only a line fits; the panel shows link-core's full text. */
export const EYE_SAFETY_SHORT_CAUTION =
  'Indicative only, not a certification: the applicable laser-safety standard, local rules and a qualified laser safety officer decide.';

const useStyles = makeStyles({
  root: {
    display: 'grid',
    rowGap: tokens.spacingVerticalS,
    padding: tokens.spacingHorizontalL,
    borderRadius: tokens.borderRadiusLarge,
    backgroundColor: tokens.colorNeutralBackground1,
    border: `1px solid ${tokens.colorNeutralStroke2}`,
  },
  heading: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', columnGap: tokens.spacingHorizontalS, rowGap: tokens.spacingVerticalXS },
  number: { textAlign: 'end', fontVariantNumeric: 'tabular-nums' },
  notes: { margin: 0, paddingInlineStart: tokens.spacingHorizontalL, color: tokens.colorNeutralForeground2 },
});

export function assessDesignEyeSafety(design: LinkDesignInput, budget: LinkBudget | null): { assessment: EyeSafetyAssessment | null; problem: string | null } {
  try {
    const assessment = assessEyeSafety(eyeSafetyInputOf(design, budget));
    return { assessment, problem: null };
  } catch (error) {
    return { assessment: null, problem: error instanceof Error ? error.message : String(error) };
  }
}

export function useEyeSafety(design: LinkDesignInput, budget: LinkBudget | null) {
  return useMemo(() => assessDesignEyeSafety(design, budget), [design, budget]);
}

const CLASS_COLOUR: Record<string, 'success' | 'warning' | 'danger' | 'severe'> = {
  '1': 'success',
  '1M': 'warning',
  '3R': 'severe',
  '3B': 'danger',
  '4': 'danger',
};

/** A few words on what the indicative class means, so the badge never relies on its colour. */
export const CLASS_MEANING: Record<string, string> = {
  '1': 'no hazard expected in normal use',
  '1M': 'hazard through binoculars or telescopes',
  '3R': 'low hazard to the naked eye',
  '3B': 'hazard to the naked eye',
  '4': 'hazard to eyes and skin',
};

export function IndicativeClassBadge({ assessment }: { assessment: EyeSafetyAssessment }) {
  const meaning = CLASS_MEANING[assessment.indicativeClass];
  return (
    <Badge
      appearance="tint"
      color={CLASS_COLOUR[assessment.indicativeClass] ?? 'informative'}
      icon={assessment.indicativeClass === '1' ? <ShieldCheckmarkRegular /> : <WarningRegular />}
      data-testid="laser-class"
    >
      Indicative Class {assessment.indicativeClass}
      {meaning ? ` · ${meaning}` : ''}
    </Badge>
  );
}

/** One line for beside a power figure: the indication and the short caution. */
export function EyeSafetyLine({ design, budget }: { design: LinkDesignInput; budget: LinkBudget | null }) {
  const { assessment, problem } = useEyeSafety(design, budget);
  if (!assessment) return <span>Eye safety not assessed ({problem}). {EYE_SAFETY_SHORT_CAUTION}</span>;
  return (
    <span data-testid="eye-safety-line">
      Indicative Class {assessment.indicativeClass}; hazard distance {formatDistance(assessment.nohdUnaidedM)} naked eye,{' '}
      {formatDistance(assessment.nohdWithOpticsM)} through 7×50 binoculars. {EYE_SAFETY_SHORT_CAUTION}
    </span>
  );
}

export function EyeSafetyPanel({ design, budget }: { design: LinkDesignInput; budget: LinkBudget | null }) {
  const styles = useStyles();
  const { assessment, problem } = useEyeSafety(design, budget);
  return (
    <section className={styles.root} aria-labelledby="eye-safety-heading" data-testid="eye-safety">
      <div className={styles.heading}>
        <EyeTrackingRegular aria-hidden />
        <Subtitle2 as="h3" id="eye-safety-heading">
          Eye safety at the transmitter
        </Subtitle2>
        {assessment && <IndicativeClassBadge assessment={assessment} />}
      </div>
      {assessment ? (
        <>
          <Table size="extra-small" aria-label="Eye-safety figures">
            <TableBody>
              <TableRow>
                <TableCell>Nominal ocular hazard distance, naked eye</TableCell>
                <TableCell className={styles.number} data-testid="nohd-unaided">
                  {formatDistance(assessment.nohdUnaidedM)}
                </TableCell>
              </TableRow>
              <TableRow>
                <TableCell>… through 7×50 binoculars (gain {assessment.opticalGain.toFixed(0)})</TableCell>
                <TableCell className={styles.number} data-testid="nohd-aided">
                  {formatDistance(assessment.nohdWithOpticsM)}
                </TableCell>
              </TableRow>
              {assessment.nohdUnaidedFarFieldM !== null && (
                <TableRow>
                  <TableCell>Far-field estimate of the naked-eye distance (for comparison only)</TableCell>
                  <TableCell className={styles.number}>{formatDistance(assessment.nohdUnaidedFarFieldM)}</TableCell>
                </TableRow>
              )}
              <TableRow>
                <TableCell>Ocular exposure limit (MPE) at the cornea</TableCell>
                <TableCell className={styles.number}>{assessment.mpeWPerM2.toPrecision(4)} W/m²</TableCell>
              </TableRow>
              <TableRow>
                <TableCell>Power through the naked-eye aperture / Class 1 limit</TableCell>
                <TableCell className={styles.number}>
                  {formatPowerW(assessment.classification.condition3PowerW)} / {formatPowerW(assessment.classification.classOneAelW)}
                </TableCell>
              </TableRow>
              <TableRow>
                <TableCell>Power through the optics aperture / Class 1 limit</TableCell>
                <TableCell className={styles.number}>
                  {formatPowerW(assessment.classification.condition1PowerW)} / {formatPowerW(assessment.classification.classOneAelW)}
                </TableCell>
              </TableRow>
            </TableBody>
          </Table>
          {assessment.notes.length > 0 && (
            <ul className={styles.notes}>
              {assessment.notes.map((note) => (
                <li key={note}>
                  <Caption1>{note}</Caption1>
                </li>
              ))}
            </ul>
          )}
          <Caption1>Limits applied: {assessment.edition}.</Caption1>
        </>
      ) : (
        <Caption1>Not assessed for this design: {problem}</Caption1>
      )}
      <MessageBar intent="warning" layout="multiline" data-testid="eye-safety-caution">
        <MessageBarBody>
          <MessageBarTitle>Laser safety</MessageBarTitle>
          {assessment?.caution ??
            'Indicative only, not a certification or a classification. Follow the applicable laser-safety standard, local regulations and the advice of a qualified laser safety officer. Never look into a transmit aperture, with or without optical instruments.'}
        </MessageBarBody>
      </MessageBar>
    </section>
  );
}

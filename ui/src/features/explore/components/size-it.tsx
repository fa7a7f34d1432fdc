import { Button, Caption1, Spinner, makeStyles, tokens } from '@fluentui/react-components';
import { WandRegular } from '@fluentui/react-icons';
import { evaluateLink, withDesignValue, type LinkDesignInput, type SolveDesignResult, type SolveDesignVariable } from '@beamwright/link-core';
import { formatAngle, formatDbm, formatDistance, formatLength } from '@/lib/format';
import { useSolver } from '@/features/explore/hooks/use-solver';

const useStyles = makeStyles({
  root: { display: 'grid', rowGap: tokens.spacingVerticalXS, justifyItems: 'start' },
  card: {
    display: 'grid',
    rowGap: tokens.spacingVerticalXS,
    padding: tokens.spacingHorizontalS,
    borderRadius: tokens.borderRadiusMedium,
    border: `1px solid ${tokens.colorNeutralStroke2}`,
    backgroundColor: tokens.colorNeutralBackground2,
    maxWidth: '60ch',
  },
  headline: { fontWeight: tokens.fontWeightSemibold },
  actions: { display: 'flex', columnGap: tokens.spacingHorizontalS, flexWrap: 'wrap' },
  muted: { color: tokens.colorNeutralForeground3 },
});

/** What each solver asks, in the engineer's words. */
const QUESTIONS: Record<SolveDesignVariable, { button: string; found: string; missing: string }> = {
  powerDbm: { button: 'Size the power for me', found: 'Least transmit power', missing: 'No transmit power in the allowed range' },
  waistRadiusM: { button: 'Size the transmit beam for me', found: 'Smallest transmit beam radius (1/e²)', missing: 'No transmit beam radius in the allowed range' },
  rangeM: { button: 'Find the longest range', found: 'Longest path length', missing: 'No path length in the allowed range' },
  halfAngleDivergenceRad: { button: 'Find the best divergence', found: 'Divergence with the most margin (1/e² half angle)', missing: 'Even the best divergence' },
};

function limitingLabel(design: LinkDesignInput, result: SolveDesignResult): string {
  const value = result.value ?? result.bestValue;
  try {
    const budget = evaluateLink(value === undefined ? design : withDesignValue(design, result.field, value));
    return budget.terms.find((term) => term.key === result.limitingTerm)?.label ?? result.limitingTerm;
  } catch {
    return result.limitingTerm;
  }
}

export interface SizeItProps {
  vary: SolveDesignVariable;
  /** the design as typed; null while a field is invalid (the button waits) */
  design: LinkDesignInput | null;
  requiredMarginDb: number;
  /** puts the value (in the field's SI unit, dBm for power) into the form */
  onUse: (valueSi: number) => void;
}

/** A "size it for me" action beside a field, with a short result card: the value, its margin, what limits it. */
const FORMATS: Record<SolveDesignVariable, (value: number) => string> = {
  powerDbm: (value) => formatDbm(value, 2),
  waistRadiusM: formatLength,
  rangeM: formatDistance,
  halfAngleDivergenceRad: formatAngle,
};

export function SizeIt({ vary, design, requiredMarginDb, onUse }: SizeItProps) {
  const formatValue = FORMATS[vary];
  const styles = useStyles();
  const solver = useSolver();
  const question = QUESTIONS[vary];
  const result = solver.result;
  return (
    <div className={styles.root}>
      <Button
        size="small"
        appearance="subtle"
        icon={solver.solving ? <Spinner size="extra-tiny" /> : <WandRegular />}
        disabled={!design || solver.solving}
        onClick={() => design && void solver.solve(design, { vary, requiredMarginDb })}
        data-testid={`size-it-${vary}`}
      >
        {question.button}
      </Button>
      {solver.error && (
        <Caption1 role="status" className={styles.muted}>
          The solver refused: {solver.error}
        </Caption1>
      )}
      {result && design && (
        <div className={styles.card} role="status" data-testid={`size-it-result-${vary}`} data-achievable={result.achievable}>
          {result.achievable && result.value !== undefined ? (
            <>
              <span className={styles.headline}>
                {question.found} for {requiredMarginDb} dB: {formatValue(result.value)}
              </span>
              <Caption1>
                It leaves a margin of {result.marginDb.toFixed(2)} dB. What limits it most: {limitingLabel(design, result)}.
              </Caption1>
              {result.transmitApertureDiameterM !== undefined && result.truncationRatio !== undefined && (
                <Caption1>
                  Transmit aperture for it: {formatLength(result.transmitApertureDiameterM)} diameter at the optimum truncation a/w = {result.truncationRatio.toFixed(3)}
                  {result.truncationClippingLossDb !== undefined ? ` (clips ${result.truncationClippingLossDb.toFixed(2)} dB, which the budget does not charge)` : ''}.
                </Caption1>
              )}
            </>
          ) : (
            <>
              <span className={styles.headline}>
                Not achievable: {question.missing.toLowerCase()} reaches {requiredMarginDb} dB.
              </span>
              <Caption1>
                The best is {result.marginDb.toFixed(2)} dB{result.bestValue !== undefined ? ` at ${formatValue(result.bestValue)}` : ''}; what limits it: {limitingLabel(design, result)}.
              </Caption1>
            </>
          )}
          {result.notes.map((note) => (
            <Caption1 key={note} className={styles.muted}>
              {note}
            </Caption1>
          ))}
          <div className={styles.actions}>
            {result.achievable && result.value !== undefined && (
              <Button size="small" appearance="primary" onClick={() => {
                  onUse(result.value!);
                  solver.clear();
                }} data-testid={`size-it-use-${vary}`}>
                Use {formatValue(result.value)}
              </Button>
            )}
            <Button size="small" onClick={solver.clear}>
              Close
            </Button>
          </div>
        </div>
      )}
    </div>
  );
}

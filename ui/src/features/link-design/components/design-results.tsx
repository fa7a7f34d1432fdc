import { useMemo } from 'react';
import { Button, MessageBar, MessageBarActions, MessageBarBody, Subtitle2, makeStyles, tokens } from '@fluentui/react-components';
import { maxRange, type LinkBudget, type LinkDesignInput } from '@beamwright/link-core';
import { THIN_MARGIN_DB } from '@/components/ui/margin-verdict';
import { BudgetHeadline } from '@/features/link-design/components/budget-headline';
import { BudgetTermsTable } from '@/features/link-design/components/budget-terms-table';
import { BudgetWaterfall, DesignCharts } from '@/features/link-design/components/design-charts';
import { EyeSafetyPanel } from '@/features/link-design/components/eye-safety-panel';

const useStyles = makeStyles({
  root: { display: 'grid', rowGap: tokens.spacingVerticalL, minWidth: 0 },
  split: { display: 'grid', gridTemplateColumns: 'repeat(auto-fit, minmax(min(440px, 100%), 1fr))', gap: tokens.spacingHorizontalL, alignItems: 'start' },
  // the margin stays in view while the engineer scrolls through the form
  sticky: {
    position: 'sticky',
    top: '56px',
    zIndex: 2,
    paddingBlock: tokens.spacingVerticalS,
    backgroundColor: tokens.colorNeutralBackground2,
    // on a phone the headline would cover most of the screen: it scrolls with the page there
    '@media (max-width: 700px)': { position: 'static' },
  },
  card: {
    backgroundColor: tokens.colorNeutralBackground1,
    border: `1px solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusLarge,
    padding: tokens.spacingHorizontalM,
    minWidth: 0,
  },
});

export interface DesignResultsProps {
  design: LinkDesignInput;
  budget: LinkBudget | null;
  /** a lagging copy of the design for the charts */
  chartDesign?: LinkDesignInput;
  /** the figures belong to the last valid design, not to what is typed now */
  stale?: boolean;
  budgetError?: string | null;
  /** switches the design to outage-based pointing (offered with the pointing-mean-hides-outage warning) */
  onUseOutagePointing?: () => void;
}

/** Everything computed from a design: margin, eye safety, the budget ledger and the charts. */
export function DesignResults({ design, budget, chartDesign, stale, budgetError, onUseOutagePointing }: DesignResultsProps) {
  const styles = useStyles();
  const range = useMemo(() => {
    try {
      return maxRange(design, THIN_MARGIN_DB);
    } catch {
      return null;
    }
  }, [design]);

  if (!budget) {
    return (
      <MessageBar intent="error">
        <MessageBarBody>The budget could not be computed for this design{budgetError ? `: ${budgetError}` : '.'}</MessageBarBody>
      </MessageBar>
    );
  }

  return (
    <div className={styles.root} data-testid="design-results">
      {stale && (
        <MessageBar intent="warning" data-testid="stale-results">
          <MessageBarBody>Some fields need fixing; the figures below are those of the last valid design.</MessageBarBody>
        </MessageBar>
      )}
      <div className={styles.sticky}>
        <BudgetHeadline budget={budget} maxRange={range} requiredMarginDb={THIN_MARGIN_DB} stale={stale} />
      </div>
      {budget.checks.length > 0 && (
        <div style={{ display: 'grid', rowGap: 8 }}>
          {budget.checks.map((check) => (
            <MessageBar key={check.key} intent={check.severity === 'warning' ? 'warning' : 'info'} data-check={check.key}>
              <MessageBarBody>{check.message}</MessageBarBody>
              {check.key === 'pointing-mean-hides-outage' && onUseOutagePointing && (
                <MessageBarActions>
                  <Button size="small" onClick={onUseOutagePointing}>
                    Use outage pointing (1e-3)
                  </Button>
                </MessageBarActions>
              )}
            </MessageBar>
          ))}
        </div>
      )}
      <div className={styles.split}>
        <section className={styles.card} aria-labelledby="budget-heading">
          <Subtitle2 as="h3" id="budget-heading">
            Link budget
          </Subtitle2>
          <BudgetTermsTable budget={budget} />
        </section>
        <BudgetWaterfall budget={budget} />
      </div>
      <EyeSafetyPanel design={design} budget={budget} />
      <DesignCharts design={chartDesign ?? design} requiredMarginDb={THIN_MARGIN_DB} budget={budget} />
    </div>
  );
}

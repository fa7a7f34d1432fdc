import { Fragment } from 'react';
import {
  Caption1,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  Tooltip,
  makeStyles,
  mergeClasses,
  tokens,
} from '@fluentui/react-components';
import { InfoRegular } from '@fluentui/react-icons';
import type { BudgetTerm, LinkBudget } from '@beamwright/link-core';
import { formatDb } from '@/lib/format';

const useStyles = makeStyles({
  number: { textAlign: 'end', fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap' },
  numberHeader: { '& .fui-TableHeaderCell__button': { justifyContent: 'flex-end' } },
  label: { display: 'flex', alignItems: 'center', columnGap: tokens.spacingHorizontalXS },
  info: { color: tokens.colorNeutralForeground3, flexShrink: 0, cursor: 'help' },
  subtotal: { backgroundColor: tokens.colorNeutralBackground3, fontWeight: tokens.fontWeightSemibold },
  total: { backgroundColor: tokens.colorBrandBackground2, fontWeight: tokens.fontWeightBold },
  tip: { display: 'grid', rowGap: tokens.spacingVerticalXS },
  tipSurface: { maxWidth: '440px' },
  tipHeading: { fontWeight: tokens.fontWeightSemibold },
  loss: { color: tokens.colorNeutralForeground1 },
});

function TermTip({ term }: { term: BudgetTerm }) {
  const styles = useStyles();
  return (
    <div className={styles.tip}>
      <span className={styles.tipHeading}>Method</span>
      <span>{term.method}</span>
      <span className={styles.tipHeading}>Source</span>
      <span>{term.source}</span>
    </div>
  );
}

/**
 * The budget as a ledger: each term with its signed contribution and the running level. The
 * running level is in dBm down to the received power; after the sensitivity it is the margin in dB.
 */
export function BudgetTermsTable({ budget }: { budget: LinkBudget }) {
  const styles = useStyles();
  let running = 0;
  const rows: { term: BudgetTerm; running: number; runningUnit: 'dBm' | 'dB' }[] = [];
  let passedSensitivity = false;
  for (const term of budget.terms) {
    running += term.valueDb;
    if (term.key === 'receiverSensitivity') passedSensitivity = true;
    rows.push({ term, running, runningUnit: passedSensitivity ? 'dB' : 'dBm' });
  }

  return (
    <Table size="small" aria-label="Link budget, term by term" data-testid="budget-terms">
      <TableHeader>
        <TableRow>
          <TableHeaderCell>Term</TableHeaderCell>
          <TableHeaderCell className={mergeClasses(styles.number, styles.numberHeader)}>Contribution</TableHeaderCell>
          <TableHeaderCell className={mergeClasses(styles.number, styles.numberHeader)}>Running level</TableHeaderCell>
        </TableRow>
      </TableHeader>
      <TableBody>
        {rows.map(({ term, running: level, runningUnit }) => (
          <Fragment key={term.key}>
            <TableRow data-term={term.key}>
              <TableCell>
                <Tooltip
                  content={{ children: <TermTip term={term} />, className: styles.tipSurface }}
                  relationship="description"
                  withArrow
                  positioning="after"
                >
                  <span className={styles.label} tabIndex={0}>
                    {term.label}
                    <InfoRegular className={styles.info} aria-hidden />
                  </span>
                </Tooltip>
              </TableCell>
              <TableCell className={styles.number}>
                {term.unit === 'dBm' && term.key === 'transmitPower'
                  ? formatDb(term.valueDb, { digits: 2, unit: 'dBm' })
                  : formatDb(term.valueDb, { digits: 2, signed: true })}
              </TableCell>
              <TableCell className={styles.number}>{formatDb(level, { digits: 2, unit: runningUnit })}</TableCell>
            </TableRow>
            {term.key === 'receiveOptics' && (
              <TableRow className={styles.subtotal}>
                <TableCell>Received power (mean)</TableCell>
                <TableCell />
                <TableCell className={styles.number}>{formatDb(budget.receivedPowerDbm, { digits: 2, unit: 'dBm' })}</TableCell>
              </TableRow>
            )}
          </Fragment>
        ))}
        <TableRow className={styles.total}>
          <TableCell>Link margin</TableCell>
          <TableCell />
          <TableCell className={styles.number} data-testid="budget-total">
            {formatDb(budget.linkMarginDb, { digits: 2, signed: true })}
          </TableCell>
        </TableRow>
      </TableBody>
      <caption style={{ captionSide: 'bottom', textAlign: 'start', paddingTop: 8 }}>
        <Caption1>Hover or focus a term to see its method and source. Losses are negative contributions.</Caption1>
      </caption>
    </Table>
  );
}

import { Caption1, Text, Tooltip, makeStyles, mergeClasses, tokens } from '@fluentui/react-components';
import { CheckmarkCircleFilled, DismissCircleFilled, WarningFilled } from '@fluentui/react-icons';
import type { LinkBudget, MaxRangeResult } from '@beamwright/link-core';
import { MARGIN_VERDICT_TEXT, THIN_MARGIN_DB, marginVerdict } from '@/components/ui/margin-verdict';
import { formatDb, formatDbm, formatDistance, formatLength, formatPercent } from '@/lib/format';

const useStyles = makeStyles({
  root: {
    display: 'grid',
    gridTemplateColumns: 'minmax(min(260px, 100%), 1fr) minmax(0, 2fr)',
    columnGap: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalM,
    alignItems: 'stretch',
    '@media (max-width: 700px)': { gridTemplateColumns: '1fr' },
  },
  stats: { display: 'grid', gridTemplateColumns: 'repeat(2, minmax(0, 1fr))', gap: tokens.spacingHorizontalS },
  margin: {
    borderRadius: tokens.borderRadiusLarge,
    padding: tokens.spacingHorizontalL,
    display: 'grid',
    rowGap: tokens.spacingVerticalXS,
    borderLeft: '6px solid',
    backgroundColor: tokens.colorNeutralBackground1,
    boxShadow: tokens.shadow4,
  },
  adequate: { borderLeftColor: tokens.colorPaletteGreenBorderActive },
  thin: { borderLeftColor: tokens.colorPaletteMarigoldBorderActive },
  fails: { borderLeftColor: tokens.colorPaletteRedBorderActive },
  marginLabel: { color: tokens.colorNeutralForeground3, textTransform: 'uppercase', letterSpacing: '0.06em', fontSize: tokens.fontSizeBase200 },
  marginValue: { fontSize: '40px', lineHeight: '48px', fontWeight: tokens.fontWeightBold, fontVariantNumeric: 'tabular-nums' },
  verdict: { display: 'flex', alignItems: 'center', columnGap: tokens.spacingHorizontalXS, fontWeight: tokens.fontWeightSemibold },
  verdictIconadequate: { color: tokens.colorPaletteGreenForeground1 },
  verdictIconthin: { color: tokens.colorPaletteMarigoldForeground1 },
  verdictIconfails: { color: tokens.colorPaletteRedForeground1 },
  stat: {
    borderRadius: tokens.borderRadiusLarge,
    paddingBlock: tokens.spacingVerticalS,
    paddingInline: tokens.spacingHorizontalM,
    backgroundColor: tokens.colorNeutralBackground1,
    border: `1px solid ${tokens.colorNeutralStroke2}`,
    display: 'grid',
    alignContent: 'start',
    rowGap: tokens.spacingVerticalXXS,
  },
  statValue: { fontSize: tokens.fontSizeBase500, fontWeight: tokens.fontWeightSemibold, fontVariantNumeric: 'tabular-nums' },
  statNote: { color: tokens.colorNeutralForeground3 },
  // Stale figures keep their full contrast (dimming them would make them unreadable): a dashed
  // outline and the words "last valid design" mark them instead.
  stale: {
    outline: `2px dashed ${tokens.colorPaletteMarigoldBorderActive}`,
    outlineOffset: '4px',
    borderRadius: tokens.borderRadiusLarge,
  },
});

export interface BudgetHeadlineProps {
  budget: LinkBudget;
  maxRange: MaxRangeResult | null;
  requiredMarginDb: number;
  /** true when the figures belong to the last valid design, not to what is typed now */
  stale?: boolean;
}

function Stat({ label, value, note, testId }: { label: string; value: string; note?: string; testId?: string }) {
  const styles = useStyles();
  return (
    <div className={styles.stat}>
      <Caption1 className={styles.statNote}>{label}</Caption1>
      <Text className={styles.statValue} data-testid={testId}>
        {value}
      </Text>
      {note && <Caption1 className={styles.statNote}>{note}</Caption1>}
    </div>
  );
}

export function BudgetHeadline({ budget, maxRange, requiredMarginDb, stale }: BudgetHeadlineProps) {
  const styles = useStyles();
  const verdict = marginVerdict(budget.linkMarginDb);
  const Icon = verdict === 'fails' ? DismissCircleFilled : verdict === 'thin' ? WarningFilled : CheckmarkCircleFilled;
  const maxRangeText =
    maxRange === null
      ? '—'
      : maxRange.status === 'not-achievable'
        ? 'not achievable'
        : maxRange.status === 'beyond-search-limit'
          ? `beyond ${formatDistance(maxRange.rangeM)}`
          : formatDistance(maxRange.rangeM);

  return (
    <div className={mergeClasses(styles.root, stale && styles.stale)}>
      {/* A polite live region: a screen reader reads the new margin and verdict once typing pauses. */}
      <div
        className={mergeClasses(styles.margin, styles[verdict])}
        data-verdict={verdict}
        aria-live="polite"
        aria-atomic="true"
        data-testid="margin-headline"
      >
        <span className={styles.marginLabel}>Link margin{stale ? ' (last valid design)' : ''}</span>
        <span className={styles.marginValue} data-testid="link-margin">
          {formatDb(budget.linkMarginDb, { digits: 2, signed: true })}
        </span>
        <Tooltip
          relationship="description"
          content={`Fails below 0 dB; thin below ${THIN_MARGIN_DB} dB (common practice). Margin = received power − sensitivity − fade margin − allowance.`}
        >
          <span className={styles.verdict} data-testid="margin-verdict">
            <Icon className={styles[`verdictIcon${verdict}`]} aria-hidden />
            {MARGIN_VERDICT_TEXT[verdict]}
            {verdict === 'fails' ? ': the link does not close' : verdict === 'thin' ? ': little left for the unexpected' : ' for the design weather'}
          </span>
        </Tooltip>
      </div>
      <div className={styles.stats}>
      <Stat label="Received power (mean)" value={formatDbm(budget.receivedPowerDbm, 2)} testId="received-power" />
      <Stat
        label="Beam at the receiver"
        value={`${formatLength(budget.beamRadiusAtReceiverM)}`}
        note={`1/e² radius · ${formatPercent(budget.captureFraction, 2)} captured`}
      />
      <Stat label={`Longest path at ${formatDb(requiredMarginDb, { digits: 0 })} margin`} value={maxRangeText} note="everything else as designed" testId="max-range" />
      <Stat
        label="Scintillation fade margin"
        value={budget.scintillationFadeMarginDb > 0 ? formatDb(budget.scintillationFadeMarginDb, { digits: 2 }) : 'left out'}
        note={budget.scintillationIndex > 0 ? `σ²I = ${budget.scintillationIndex.toPrecision(3)} (aperture averaged)` : undefined}
      />
      </div>
    </div>
  );
}

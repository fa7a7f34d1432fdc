import { Badge, Tooltip } from '@fluentui/react-components';
import { CheckmarkCircleFilled, DismissCircleFilled, WarningFilled } from '@fluentui/react-icons';
import { formatDb } from '@/lib/format';

/**
 * Link margin bands [common practice]: a link with no margin left fails on the design's own
 * assumptions; under about 3 dB, component tolerances, ageing and misalignment can use it up.
 */
export const THIN_MARGIN_DB = 3;

export type MarginVerdict = 'fails' | 'thin' | 'adequate';

export function marginVerdict(linkMarginDb: number): MarginVerdict {
  if (!(linkMarginDb >= 0)) return 'fails';
  return linkMarginDb < THIN_MARGIN_DB ? 'thin' : 'adequate';
}

export const MARGIN_VERDICT_TEXT: Record<MarginVerdict, string> = {
  fails: 'Fails',
  thin: 'Thin',
  adequate: 'Adequate',
};

const VERDICT_EXPLANATION: Record<MarginVerdict, string> = {
  fails: 'No margin left: the received power is below what the receiver needs under the design conditions.',
  thin: `Under ${THIN_MARGIN_DB} dB left: tolerances, ageing and misalignment can use this up (common practice).`,
  adequate: `At least ${THIN_MARGIN_DB} dB left under the design conditions.`,
};

/** The margin as a number with a worded verdict and an icon, so it never relies on colour alone. */
export function MarginBadge({ linkMarginDb, size = 'medium' }: { linkMarginDb: number | null | undefined; size?: 'small' | 'medium' | 'large' }) {
  if (linkMarginDb === null || linkMarginDb === undefined || !Number.isFinite(linkMarginDb)) {
    return <Badge appearance="outline" color="informative" size={size}>—</Badge>;
  }
  const verdict = marginVerdict(linkMarginDb);
  const color = verdict === 'fails' ? 'danger' : verdict === 'thin' ? 'warning' : 'success';
  const icon = verdict === 'fails' ? <DismissCircleFilled /> : verdict === 'thin' ? <WarningFilled /> : <CheckmarkCircleFilled />;
  return (
    <Tooltip content={VERDICT_EXPLANATION[verdict]} relationship="description">
      <Badge appearance="tint" color={color} size={size} icon={icon} data-verdict={verdict}>
        <span className="numeric">{formatDb(linkMarginDb, { signed: true })}</span>&nbsp;·&nbsp;{MARGIN_VERDICT_TEXT[verdict]}
      </Badge>
    </Tooltip>
  );
}

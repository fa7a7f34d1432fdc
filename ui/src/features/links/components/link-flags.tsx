import { Badge, Caption1, makeStyles, tokens } from '@fluentui/react-components';
import { ArchiveRegular, LocationRegular, WarningRegular } from '@fluentui/react-icons';
import { formatDb } from '@/lib/format';
import type { LinkSummary } from '@beamwright/link-core/contracts';

const useStyles = makeStyles({
  engineFigures: { flexBasis: '100%', color: tokens.colorNeutralForeground3 },
});

/**
 * The marks beside a link's status: "Changed since approval" when a site under an approved or
 * installed link moved after the approval, and "Archived". Each is a word with an icon, never
 * colour alone.
 */
export function LinkFlags({ link }: { link: Pick<LinkSummary, 'changedSinceApproval' | 'archived'> }) {
  return (
    <>
      {link.changedSinceApproval && (
        <Badge appearance="outline" color="danger" icon={<LocationRegular />} data-testid="changed-since-approval">
          Changed since approval
        </Badge>
      )}
      {link.archived && (
        <Badge appearance="outline" color="subtle" icon={<ArchiveRegular />} data-testid="archived-flag">
          Archived
        </Badge>
      )}
    </>
  );
}

/**
 * "Below margin with engine x.y.z": an approved or installed link whose latest revision an older
 * engine computed, and whose margin under the current engine is below the required one. The word
 * and icon carry it, the figures follow as a caption; nothing when the link is not affected.
 */
export function EngineMarginFlag({ link }: { link: Pick<LinkSummary, 'status' | 'linkMarginDb' | 'currentEngine'> }) {
  const styles = useStyles();
  const current = link.currentEngine;
  if (!current?.belowRequiredMargin || (link.status !== 'approved' && link.status !== 'installed')) return null;
  return (
    <>
      <Badge appearance="outline" color="danger" icon={<WarningRegular />} data-testid="engine-margin-flag">
        Below margin with engine {current.linkCoreVersion}
      </Badge>
      <Caption1 className={styles.engineFigures} data-testid="engine-margin-figures">
        {`Stored ${formatDb(link.linkMarginDb, { digits: 2 })}; engine ${current.linkCoreVersion} gives ${formatDb(current.linkMarginDb, { digits: 2 })} (${formatDb(current.marginChangeDb, { digits: 2, signed: true })}), under the required 3 dB.`}
      </Caption1>
    </>
  );
}

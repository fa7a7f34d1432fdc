import { Caption1, Text, makeStyles, tokens } from '@fluentui/react-components';
import { ArchiveRegular, ArrowReplyRegular, ArrowUndoRegular, CheckmarkStarburstRegular, LocationRegular, PlugConnectedRegular, RenameRegular, SendRegular } from '@fluentui/react-icons';
import type { ReviewEntry } from '@beamwright/link-core/contracts';
import { formatDateTime } from '@/lib/format';

const useStyles = makeStyles({
  list: { listStyle: 'none', margin: 0, padding: 0, display: 'grid', rowGap: tokens.spacingVerticalM },
  item: { display: 'grid', gridTemplateColumns: '28px 1fr', columnGap: tokens.spacingHorizontalS },
  icon: { fontSize: '20px', color: tokens.colorBrandForeground1, paddingTop: '2px' },
  comment: {
    marginTop: tokens.spacingVerticalXS,
    padding: tokens.spacingHorizontalS,
    borderLeft: `3px solid ${tokens.colorNeutralStroke1}`,
    backgroundColor: tokens.colorNeutralBackground3,
    whiteSpace: 'pre-wrap',
  },
  muted: { color: tokens.colorNeutralForeground3 },
});

const ACTION_TEXT: Record<ReviewEntry['action'], string> = {
  submit: 'submitted revision {n} for review',
  approve: 'approved revision {n}',
  return: 'returned revision {n} to the engineer',
  install: 'recorded revision {n} as installed',
  renamed: 'renamed the link (revision {n})',
  path_changed: 'changed the path of revision {n}',
  archived: 'archived the link',
  restored: 'restored the link from the archive',
};

const ACTION_ICON = {
  submit: SendRegular,
  approve: CheckmarkStarburstRegular,
  return: ArrowReplyRegular,
  install: PlugConnectedRegular,
  renamed: RenameRegular,
  path_changed: LocationRegular,
  archived: ArchiveRegular,
  restored: ArrowUndoRegular,
} as const;

/** Who moved the link through review, when, and what they said. */
export function ReviewTrail({ entries }: { entries: ReviewEntry[] }) {
  const styles = useStyles();
  if (entries.length === 0) return <Caption1 className={styles.muted}>No review activity yet.</Caption1>;
  return (
    <ol className={styles.list} data-testid="review-trail">
      {[...entries].reverse().map((entry) => {
        const Icon = ACTION_ICON[entry.action];
        return (
          <li key={entry.id} className={styles.item}>
            <Icon className={styles.icon} aria-hidden />
            <div>
              <Text weight="semibold">{entry.actor.displayName}</Text> <Text>{ACTION_TEXT[entry.action].replace('{n}', String(entry.revision))}</Text>
              <div>
                <Caption1 className={styles.muted}>{formatDateTime(entry.createdAt)}</Caption1>
              </div>
              {entry.comment && <div className={styles.comment}>{entry.comment}</div>}
            </div>
          </li>
        );
      })}
    </ol>
  );
}

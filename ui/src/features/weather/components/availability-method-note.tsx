import { Caption1, makeStyles, tokens } from '@fluentui/react-components';
import { InfoRegular } from '@fluentui/react-icons';
import type { AvailabilityMethod } from '@beamwright/link-core/contracts';

const useStyles = makeStyles({
  note: {
    display: 'grid',
    gridTemplateColumns: 'auto 1fr',
    columnGap: tokens.spacingHorizontalS,
    padding: tokens.spacingHorizontalM,
    borderRadius: tokens.borderRadiusMedium,
    backgroundColor: tokens.colorNeutralBackground2,
    border: `1px solid ${tokens.colorNeutralStroke2}`,
  },
  icon: { fontSize: '20px', color: tokens.colorBrandForeground1, marginTop: '2px' },
  list: { margin: `${tokens.spacingVerticalXS} 0 0`, paddingInlineStart: tokens.spacingHorizontalL, display: 'grid', rowGap: tokens.spacingVerticalXXS },
});

/** How the figures beside it were computed, and what they leave out (always shown with them). */
export function AvailabilityMethodNote({ method, testId }: { method: AvailabilityMethod; testId?: string }) {
  const styles = useStyles();
  return (
    <section className={styles.note} aria-label="Method and assumptions" data-testid={testId}>
      <InfoRegular className={styles.icon} aria-hidden />
      <div>
        <Caption1 as="p" style={{ margin: 0 }}>
          <strong>Method.</strong> {method.summary}
        </Caption1>
        <ul className={styles.list}>
          {method.assumptions.map((assumption) => (
            <li key={assumption}>
              <Caption1>{assumption}</Caption1>
            </li>
          ))}
        </ul>
      </div>
    </section>
  );
}

import { Button, MessageBar, MessageBarActions, MessageBarBody, MessageBarTitle, makeStyles, tokens } from '@fluentui/react-components';
import { DismissRegular } from '@fluentui/react-icons';
import { designFieldLabel } from '@/features/link-design/design-diff';
import type { RebaseNotice } from '@/features/link-design/hooks/use-draft-persistence';

const useStyles = makeStyles({
  notices: { display: 'grid', rowGap: tokens.spacingVerticalS, marginBottom: tokens.spacingVerticalM },
});

function Dismiss({ onClick }: { onClick: () => void }) {
  return <Button appearance="transparent" icon={<DismissRegular />} aria-label="Dismiss" onClick={onClick} />;
}

/** Save, failure, restore and rebase notices of the editor, announced as they appear (one live region). */
export function EditorNotices({
  savedRevision,
  onDismissSaved,
  saveError,
  showRestored,
  onDismissRestored,
  rebaseNotice,
  onDismissRebase,
}: {
  savedRevision: number | null;
  onDismissSaved: () => void;
  saveError: string | null;
  showRestored: boolean;
  onDismissRestored: () => void;
  rebaseNotice: RebaseNotice | null;
  onDismissRebase: () => void;
}) {
  const styles = useStyles();
  return (
    <div className={styles.notices} role="status" aria-live="polite" data-testid="workspace-notices">
      {savedRevision !== null && (
        <MessageBar intent="success" data-testid="saved-notice">
          <MessageBarBody>Saved as revision {savedRevision}. It is a draft until submitted for review.</MessageBarBody>
          <MessageBarActions containerAction={<Dismiss onClick={onDismissSaved} />} />
        </MessageBar>
      )}
      {saveError && (
        <MessageBar intent="error">
          <MessageBarBody>{saveError}</MessageBarBody>
        </MessageBar>
      )}
      {showRestored && (
        <MessageBar intent="info" data-testid="restored-notice">
          <MessageBarBody>Your unsaved edits to this link were kept in this browser tab and are back. Save them or discard them.</MessageBarBody>
          <MessageBarActions containerAction={<Dismiss onClick={onDismissRestored} />} />
        </MessageBar>
      )}
      {rebaseNotice && (
        <MessageBar intent="info" layout="multiline" data-testid="rebase-notice">
          <MessageBarBody>
            <MessageBarTitle>Now editing on top of revision {rebaseNotice.revision}</MessageBarTitle>
            Your edits were re-applied: {rebaseNotice.reapplied.map(designFieldLabel).join(', ') || 'none'}.
            {rebaseNotice.overlapping.length > 0 &&
              ` Both you and the other save changed ${rebaseNotice.overlapping.map(designFieldLabel).join(', ')}: your value is kept — check it before saving.`}
          </MessageBarBody>
          <MessageBarActions containerAction={<Dismiss onClick={onDismissRebase} />} />
        </MessageBar>
      )}
    </div>
  );
}

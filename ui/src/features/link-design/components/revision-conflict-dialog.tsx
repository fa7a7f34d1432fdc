import { Body1, Button, Caption1, Dialog, DialogActions, DialogBody, DialogContent, DialogSurface, DialogTitle } from '@fluentui/react-components';
import type { LinkDesignInput } from '@beamwright/link-core';
import type { DesignChange } from '@/features/link-design/design-diff';
import { DesignChangesTable } from '@/features/link-design/components/design-changes-table';
import { useEditorDialogStyles } from '@/features/link-design/components/dialog-styles';

/** Someone saved on top of our base: their revision, and both sides' changes in words. */
export interface RevisionConflictState {
  latestRevision: number;
  latestDesign: LinkDesignInput;
  theirChanges: DesignChange[];
  myChanges: DesignChange[];
}

/** Shows what the other save changed and offers to re-apply the edits on top of it; nothing typed is lost. */
export function RevisionConflictDialog({
  conflict,
  baseRevision,
  onKeepEditing,
  onReapply,
}: {
  conflict: RevisionConflictState | null;
  baseRevision: number;
  onKeepEditing: () => void;
  onReapply: () => void;
}) {
  const styles = useEditorDialogStyles();
  return (
    <Dialog open={conflict !== null} modalType="alert">
      <DialogSurface className={styles.wideDialog}>
        <DialogBody>
          <DialogTitle>Revision {conflict?.latestRevision} was saved while you were editing</DialogTitle>
          <DialogContent className={styles.dialogGrid}>
            <Body1>
              Your edits started from revision {baseRevision}. Nothing you typed is lost: you can load revision {conflict?.latestRevision} and re-apply
              your edits on top of it, then check and save again.
            </Body1>
            <Caption1>What the other save changed</Caption1>
            <div className={styles.changes}>
              <DesignChangesTable
                changes={conflict?.theirChanges ?? []}
                beforeLabel={`Revision ${baseRevision}`}
                afterLabel={`Revision ${conflict?.latestRevision}`}
                testId="conflict-their-changes"
              />
            </div>
            <Caption1>Your edits</Caption1>
            <div className={styles.changes}>
              <DesignChangesTable changes={conflict?.myChanges ?? []} beforeLabel={`Revision ${baseRevision}`} afterLabel="Yours" />
            </div>
          </DialogContent>
          <DialogActions>
            <Button appearance="secondary" onClick={onKeepEditing}>
              Keep editing as is
            </Button>
            <Button appearance="primary" onClick={onReapply}>
              Load revision {conflict?.latestRevision} and re-apply my edits
            </Button>
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}

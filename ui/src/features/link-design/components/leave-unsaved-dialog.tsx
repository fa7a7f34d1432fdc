import { Button, Dialog, DialogActions, DialogBody, DialogContent, DialogSurface, DialogTitle } from '@fluentui/react-components';

/** Asked when a route change would drop unsaved edits (see useUnsavedEditsGuard). */
export function LeaveUnsavedDialog({
  open,
  changedCount,
  baseRevision,
  onStay,
  onLeave,
}: {
  open: boolean;
  changedCount: number;
  baseRevision: number;
  onStay: () => void;
  onLeave: () => void;
}) {
  return (
    <Dialog open={open} modalType="alert">
      <DialogSurface>
        <DialogBody>
          <DialogTitle>Leave without saving?</DialogTitle>
          <DialogContent>
            {changedCount} field{changedCount === 1 ? ' has' : 's have'} changed since revision {baseRevision}. Leaving now drops these edits.
          </DialogContent>
          <DialogActions>
            <Button appearance="primary" onClick={onStay}>
              Stay and keep editing
            </Button>
            <Button onClick={onLeave}>Leave and drop the edits</Button>
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}

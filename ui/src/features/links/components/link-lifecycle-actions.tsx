import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import {
  Body1,
  Button,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  MessageBar,
  MessageBarBody,
  Spinner,
} from '@fluentui/react-components';
import { ArchiveRegular, ArrowUndoRegular, DeleteRegular } from '@fluentui/react-icons';
import { allowedLinkActions } from '@beamwright/link-core/contracts';
import { paths } from '@/config/paths';
import { useCurrentUser } from '@/lib/auth';
import { useSetLinkArchived } from '@/features/links/api/archive-link';
import { useDeleteLink } from '@/features/links/api/delete-link';
import type { LinkDetail } from '@/features/links/api/types';

type Step = 'delete' | 'archive' | 'restore';

const STEP_TEXT: Record<Step, { title: string; explain: string; confirm: string }> = {
  delete: {
    title: 'Delete this link?',
    explain: 'The link, all its revisions and its review trail are removed for good. Only a draft that was never approved can be deleted.',
    confirm: 'Delete link',
  },
  archive: {
    title: 'Archive this link?',
    explain: 'An archived link stays readable with its revisions and trail, is hidden from the links list unless archived links are shown, and takes no changes until it is restored.',
    confirm: 'Archive',
  },
  restore: {
    title: 'Restore this link?',
    explain: 'The link returns to the links list with the status it had, and can be changed again.',
    confirm: 'Restore',
  },
};

/**
 * Delete, archive or restore the whole link, as the shared rules allow the caller (a never-approved
 * draft may be deleted by its owner; anything else is archived). Each asks for confirmation.
 */
export function LinkLifecycleActions({ link }: { link: LinkDetail }) {
  const me = useCurrentUser().data;
  const navigate = useNavigate();
  const archive = useSetLinkArchived(link.id);
  const remove = useDeleteLink(link.id);
  const [open, setOpen] = useState<Step | null>(null);
  const [error, setError] = useState<string | null>(null);
  const allowed = allowedLinkActions(me?.role, {
    status: link.status,
    wasApproved: link.wasApproved,
    archived: link.archived,
    isOwner: me?.user.id === link.owner.id,
  });
  const steps = (['delete', 'archive', 'restore'] as const).filter((step) => allowed[step]);
  if (steps.length === 0) return null;
  const pending = archive.isPending || remove.isPending;

  const confirm = () => {
    if (!open) return;
    setError(null);
    const onError = (failure: Error) => setError(failure.message);
    if (open === 'delete') {
      remove.mutate(undefined, { onSuccess: () => navigate(paths.app.links.getHref(), { replace: true }), onError });
    } else {
      archive.mutate(open === 'archive', { onSuccess: () => setOpen(null), onError });
    }
  };

  return (
    <>
      {steps.map((step) => (
        <Button
          key={step}
          appearance="secondary"
          icon={step === 'delete' ? <DeleteRegular /> : step === 'archive' ? <ArchiveRegular /> : <ArrowUndoRegular />}
          onClick={() => {
            setError(null);
            setOpen(step);
          }}
        >
          {STEP_TEXT[step].confirm}
        </Button>
      ))}
      <Dialog open={open !== null} onOpenChange={(_, data) => !data.open && setOpen(null)} modalType="alert">
        <DialogSurface>
          <DialogBody>
            <DialogTitle>{open && STEP_TEXT[open].title}</DialogTitle>
            <DialogContent>
              <Body1>
                “{link.name}”: {open && STEP_TEXT[open].explain}
              </Body1>
              {error && (
                <MessageBar intent="error" style={{ marginTop: 12 }}>
                  <MessageBarBody>{error}</MessageBarBody>
                </MessageBar>
              )}
            </DialogContent>
            <DialogActions>
              <Button onClick={() => setOpen(null)}>Cancel</Button>
              <Button appearance="primary" onClick={confirm} disabled={pending} icon={pending ? <Spinner size="tiny" /> : undefined}>
                {open && STEP_TEXT[open].confirm}
              </Button>
            </DialogActions>
          </DialogBody>
        </DialogSurface>
      </Dialog>
    </>
  );
}

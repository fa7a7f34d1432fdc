import { createContext, useContext, useState, type ReactNode } from 'react';
import { useNavigate } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
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
import { paths } from '@/config/paths';
import { linkKeys } from '@/lib/query-keys';
import { useSetLinkArchived } from '@/features/links/api/archive-link';
import { useDeleteLink } from '@/features/links/api/delete-link';
import type { LinkDetail } from '@beamwright/link-core/contracts';

export type LinkLifecycleStep = 'delete' | 'archive' | 'restore';

export const LIFECYCLE_TEXT: Record<LinkLifecycleStep, { title: string; explain: string; confirm: string }> = {
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

const LinkLifecycleContext = createContext<((link: LinkDetail, step: LinkLifecycleStep) => void) | null>(null);

/** Opens the confirmation of a delete, archive or restore (needs <LinkLifecycleDialogHost> above). */
export function useConfirmLinkLifecycle() {
  const ask = useContext(LinkLifecycleContext);
  if (!ask) throw new Error('useConfirmLinkLifecycle needs a <LinkLifecycleDialogHost> above it');
  return ask;
}

/**
 * Holds the one confirmation dialog for deleting, archiving and restoring links. It sits above the
 * routes because each of those steps replaces the page that asked for it (the workspace swaps
 * editor and viewer, a delete leaves for the list): a modal dialog unmounted with its page leaves
 * the rest of the app hidden from assistive technology.
 */
export function LinkLifecycleDialogHost({ children }: { children: ReactNode }) {
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const archive = useSetLinkArchived();
  const remove = useDeleteLink();
  const [request, setRequest] = useState<{ link: LinkDetail; step: LinkLifecycleStep } | null>(null);
  const [open, setOpen] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const pending = archive.isPending || remove.isPending;
  const text = request ? LIFECYCLE_TEXT[request.step] : null;

  const ask = (link: LinkDetail, step: LinkLifecycleStep) => {
    setRequest({ link, step });
    setError(null);
    setOpen(true);
  };

  const confirm = () => {
    if (!request) return;
    setError(null);
    const onError = (failure: Error) => setError(failure.message);
    const { link, step } = request;
    if (step === 'delete') {
      remove.mutate(link.id, {
        onSuccess: () => {
          setOpen(false);
          navigate(paths.app.links.getHref(), { replace: true });
          queryClient.removeQueries({ queryKey: linkKeys.detail(link.id) });
        },
        onError,
      });
    } else {
      archive.mutate({ linkId: link.id, archived: step === 'archive' }, { onSuccess: () => setOpen(false), onError });
    }
  };

  return (
    <LinkLifecycleContext.Provider value={ask}>
      {children}
      <Dialog open={open} onOpenChange={(_, data) => !data.open && setOpen(false)} modalType="alert">
        <DialogSurface>
          <DialogBody>
            <DialogTitle>{text?.title}</DialogTitle>
            <DialogContent>
              <Body1>
                “{request?.link.name}”: {text?.explain}
              </Body1>
              {error && (
                <MessageBar intent="error" style={{ marginTop: 12 }}>
                  <MessageBarBody>{error}</MessageBarBody>
                </MessageBar>
              )}
            </DialogContent>
            <DialogActions>
              <Button onClick={() => setOpen(false)}>Cancel</Button>
              <Button appearance="primary" onClick={confirm} disabled={pending} icon={pending ? <Spinner size="tiny" /> : undefined}>
                {text?.confirm}
              </Button>
            </DialogActions>
          </DialogBody>
        </DialogSurface>
      </Dialog>
    </LinkLifecycleContext.Provider>
  );
}

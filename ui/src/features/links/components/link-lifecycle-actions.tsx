import type { ReactElement } from 'react';
import { Button } from '@fluentui/react-components';
import { ArchiveRegular, ArrowUndoRegular, DeleteRegular } from '@fluentui/react-icons';
import { allowedLinkActions } from '@beamwright/link-core/contracts';
import { useCurrentUser } from '@/lib/auth';
import { LIFECYCLE_TEXT, useConfirmLinkLifecycle, type LinkLifecycleStep } from '@/features/links/components/link-lifecycle-dialog';
import type { LinkDetail } from '@beamwright/link-core/contracts';

const STEP_ICON: Record<LinkLifecycleStep, ReactElement> = { delete: <DeleteRegular />, archive: <ArchiveRegular />, restore: <ArrowUndoRegular /> };

/**
 * Delete, archive or restore the whole link, as the shared rules allow the caller (a never-approved
 * draft may be deleted by its owner; anything else is archived). Each asks for confirmation.
 */
export function LinkLifecycleActions({ link }: { link: LinkDetail }) {
  const me = useCurrentUser().data;
  const ask = useConfirmLinkLifecycle();
  const allowed = allowedLinkActions(me?.role, {
    status: link.status,
    wasApproved: link.wasApproved,
    archived: link.archived,
    isOwner: me?.user.id === link.owner.id,
  });
  const steps = (['delete', 'archive', 'restore'] as const).filter((step) => allowed[step]);
  return (
    <>
      {steps.map((step) => (
        <Button key={step} appearance="secondary" icon={STEP_ICON[step]} onClick={() => ask(link, step)}>
          {LIFECYCLE_TEXT[step].confirm}
        </Button>
      ))}
    </>
  );
}

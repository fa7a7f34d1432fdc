import { useEffect, useRef, useState } from 'react';
import type { LinkDesignInput } from '@beamwright/link-core';
import { rebaseDraft } from '@/features/link-design/design-rebase';
import { clearStoredDraft, loadStoredDraft, storeDraft } from '@/features/link-design/draft-storage';
import type { DesignWorkspace } from '@/features/link-design/hooks/use-design-workspace';

/** The edits now sit on top of a newer revision than the one they started from. */
export interface RebaseNotice {
  revision: number;
  reapplied: string[];
  overlapping: string[];
}

/**
 * Unsaved edits survive a reload: they are kept in this tab's sessionStorage while there are any,
 * and on the first render they come back, re-applied on the latest revision if it moved on.
 */
export function useDraftPersistence({
  linkId,
  stored: { revision, design },
  baseRevision,
  workspace,
}: {
  linkId: string;
  /** the link's latest revision as the server has it */
  stored: { revision: number; design: LinkDesignInput };
  /** the revision the edits sit on now */
  baseRevision: number;
  workspace: DesignWorkspace;
}) {
  const [restoredNotice, setRestoredNotice] = useState(false);
  const [rebaseNotice, setRebaseNotice] = useState<RebaseNotice | null>(null);
  const hasChanges = workspace.changedFieldIds.length > 0;

  const restored = useRef(false);
  useEffect(() => {
    if (restored.current) return;
    restored.current = true;
    const kept = loadStoredDraft(linkId);
    if (!kept) return;
    if (kept.baseRevision === revision) {
      workspace.replaceDraft(kept.draft, design);
    } else {
      const result = rebaseDraft(kept.draft, kept.base, design);
      workspace.replaceDraft(result.draft, design);
      setRebaseNotice({ revision, reapplied: result.reapplied, overlapping: result.overlapping });
    }
    setRestoredNotice(true);
  }, [linkId, revision, design, workspace]);

  useEffect(() => {
    if (!restored.current) return;
    if (hasChanges) storeDraft(linkId, { baseRevision, base: workspace.base, draft: workspace.draft });
    else clearStoredDraft(linkId);
  }, [hasChanges, linkId, baseRevision, workspace.base, workspace.draft]);

  /** After a save or a discard: nothing kept, no notice about kept edits. */
  const forget = () => {
    clearStoredDraft(linkId);
    setRestoredNotice(false);
    setRebaseNotice(null);
  };

  return { restoredNotice, dismissRestored: () => setRestoredNotice(false), rebaseNotice, setRebaseNotice, forget };
}

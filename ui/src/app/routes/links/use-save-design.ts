import { useEffect, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { LinkDetail } from '@beamwright/link-core/contracts';
import { apiFieldIssues, mapIssuesToFields } from '@/lib/form-errors';
import { linkKeys } from '@/lib/query-keys';
import { getLinkQueryOptions } from '@/features/links/api/get-link';
import { readRevisionConflict, useSaveRevision } from '@/features/links/api/save-revision';
import { rebaseDraft } from '@/features/link-design/design-rebase';
import { draftFromDesign } from '@/features/link-design/design-draft';
import { designFieldLabel, diffDesigns } from '@/features/link-design/design-diff';
import type { DesignWorkspace } from '@/features/link-design/hooks/use-design-workspace';
import type { RebaseNotice } from '@/features/link-design/hooks/use-draft-persistence';
import type { RevisionConflictState } from '@/features/link-design/components/revision-conflict-dialog';
import type { SaveAttempt } from '@/features/link-design/components/save-revision-dialog';
import type { VariantSet } from '@/features/variants/hooks/use-variant-set';

/** The outcome of a save as the editor needs it: whether the dialog stays open. */
export type SaveOutcome = SaveAttempt & { keepDialogOpen: boolean };

/**
 * Saving the edited design and its alternatives as revision n+1: a 400 puts the api's reasons
 * beside their fields (a design field in the form, `variants.N.…` beside alternative N), a 409
 * (someone saved first) opens the conflict with both sides' changes, and re-applying the edits on
 * the latest revision moves the base on.
 */
export function useSaveDesign(link: LinkDetail, workspace: DesignWorkspace, variantSet: VariantSet) {
  const queryClient = useQueryClient();
  const saveRevision = useSaveRevision(link.id);
  const [baseRevision, setBaseRevision] = useState(link.revision);
  const [serverErrors, setServerErrors] = useState<Record<string, string>>({});
  const [variantErrors, setVariantErrors] = useState<Partial<Record<number, string>>>({});
  const [saveError, setSaveError] = useState<string | null>(null);
  const [savedRevision, setSavedRevision] = useState<number | null>(null);
  const [conflict, setConflict] = useState<RevisionConflictState | null>(null);

  // A fresh edit supersedes the server's verdict on the previous attempt.
  useEffect(() => {
    setServerErrors({});
  }, [workspace.draft]);
  useEffect(() => {
    setVariantErrors({});
  }, [variantSet.variants]);

  const save = async (note: string): Promise<SaveOutcome> => {
    if (!workspace.design) return { saved: false, keepDialogOpen: true };
    setSaveError(null);
    try {
      const saved = await saveRevision.mutateAsync({ baseRevision, design: workspace.design, note, variants: variantSet.toRequest() });
      workspace.replaceDraft(workspace.draft, saved.design);
      variantSet.reset(saved.variants, saved.revision);
      setBaseRevision(saved.revision);
      setSavedRevision(saved.revision);
      return { saved: true, keepDialogOpen: false };
    } catch (error) {
      const found = readRevisionConflict(error);
      if (found) {
        let { latestDesign, latestRevision } = found;
        if (!latestDesign) {
          const latest = await queryClient.fetchQuery({ ...getLinkQueryOptions(link.id), staleTime: 0 });
          latestDesign = latest.design;
          latestRevision = latest.revision;
        }
        setConflict({
          latestRevision,
          latestDesign,
          theirChanges: diffDesigns(workspace.base, latestDesign),
          myChanges: workspace.design ? diffDesigns(workspace.base, workspace.design) : [],
        });
        return { saved: false, keepDialogOpen: false };
      }
      const issues = apiFieldIssues(error);
      if (issues.length > 0) {
        // design fields are named by their path inside the design; the note is the dialog's
        // an alternative's problem goes beside that alternative: "Name …" or "Design: <field> …"
        const byVariant: Partial<Record<number, string>> = {};
        for (const issue of issues) {
          const match = /^variants\.(\d+)(?:\.(.*))?$/.exec(issue.path);
          if (!match) continue;
          const [, position, rest = ''] = match;
          const where = rest === 'name' ? 'Name' : rest.startsWith('design.') ? designFieldLabel(rest.slice('design.'.length)) : 'This alternative';
          byVariant[Number(position)] ??= `${where} ${issue.message}`;
        }
        const listIssue = issues.find((issue) => issue.path === 'variants');
        const { fieldErrors, unmatched } = mapIssuesToFields(
          issues.filter((issue) => !issue.path.startsWith('variants')),
          (path) => {
            if (path === 'note') return { field: 'note', label: 'Note' };
            const fieldPath = path.replace(/^design\./, '');
            return { field: fieldPath, label: designFieldLabel(fieldPath) };
          },
        );
        const { note: noteError, ...designErrors } = fieldErrors;
        setServerErrors(designErrors as Record<string, string>);
        setVariantErrors(byVariant);
        const variantTrouble = Object.keys(byVariant).length > 0 || listIssue !== undefined;
        if (noteError && unmatched.length === 0 && Object.keys(designErrors).length === 0 && !variantTrouble) return { saved: false, noteError, keepDialogOpen: true };
        setSaveError(
          variantTrouble
            ? `The server refused some values${listIssue ? ` (alternatives ${listIssue.message})` : ''}; they are marked next to their fields and under Alternatives.`
            : 'The server refused some values; they are marked next to their fields.',
        );
        return { saved: false, keepDialogOpen: false };
      }
      setSaveError(error instanceof Error ? error.message : 'Saving failed.');
      return { saved: false, keepDialogOpen: true };
    }
  };

  /** Takes the other save as the new base and re-applies the edits on it; returns what to tell the engineer. */
  const reapplyOnLatest = (): RebaseNotice | null => {
    if (!conflict) return null;
    const result = rebaseDraft(workspace.draft, workspace.base, conflict.latestDesign);
    workspace.replaceDraft(result.draft, conflict.latestDesign);
    setBaseRevision(conflict.latestRevision);
    setConflict(null);
    void queryClient.invalidateQueries({ queryKey: linkKeys.detail(link.id) });
    return { revision: conflict.latestRevision, reapplied: result.reapplied, overlapping: result.overlapping };
  };

  /** After a promotion made revision n+1 elsewhere in the workspace: it becomes the base. */
  const adopt = (detail: LinkDetail) => {
    workspace.replaceDraft(draftFromDesign(detail.design), detail.design);
    variantSet.reset(detail.variants, detail.revision);
    setBaseRevision(detail.revision);
    setSavedRevision(detail.revision);
  };

  return {
    baseRevision,
    serverErrors,
    variantErrors,
    adopt,
    saveError,
    clearSaveError: () => setSaveError(null),
    savedRevision,
    dismissSaved: () => setSavedRevision(null),
    conflict,
    dismissConflict: () => setConflict(null),
    pending: saveRevision.isPending,
    save,
    reapplyOnLatest,
  };
}

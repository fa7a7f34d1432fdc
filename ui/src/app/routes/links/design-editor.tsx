import { useEffect, useRef, useState, type ReactNode } from 'react';
import { useBlocker } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import {
  Body1,
  Button,
  Caption1,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  Field,
  MessageBar,
  MessageBarActions,
  MessageBarBody,
  MessageBarTitle,
  Spinner,
  Textarea,
  makeStyles,
  tokens,
  useRestoreFocusTarget,
} from '@fluentui/react-components';
import { ArrowUndoRegular, DismissRegular, SaveRegular } from '@fluentui/react-icons';
import type { LinkDesignInput } from '@beamwright/link-core';
import { apiFieldIssues, mapIssuesToFields } from '@/lib/form-errors';
import { linkKeys } from '@/lib/query-keys';
import { LinkHeader } from '@/features/links/components/link-header';
import { getLinkQueryOptions } from '@/features/links/api/get-link';
import { readRevisionConflict, useSaveRevision } from '@/features/links/api/save-revision';
import type { LinkDetail } from '@beamwright/link-core/contracts';
import { useDesignWorkspace } from '@/features/link-design/hooks/use-design-workspace';
import { DesignForm } from '@/features/link-design/components/design-form';
import { DesignResults } from '@/features/link-design/components/design-results';
import { EyeSafetyLine } from '@/features/link-design/components/eye-safety-panel';
import { applyReceiverSpec, applyTransmitterSpec, draftFromDesign, rebaseDraft } from '@/features/link-design/design-draft';
import { clearStoredDraft, loadStoredDraft, storeDraft } from '@/features/link-design/draft-storage';
import { designFieldLabel, diffDesigns, type DesignChange } from '@/features/link-design/design-diff';
import { EquipmentPicker } from '@/features/equipment/components/equipment-picker';
import { SitePathSummary } from '@/features/sites/components/site-path-summary';
import { useWorkspaceStyles } from '@/app/routes/links/workspace-layout';
import { DesignChangesTable as ChangesTable } from '@/features/link-design/components/design-changes-table';

const useStyles = makeStyles({
  statusBar: { display: 'flex', alignItems: 'center', columnGap: tokens.spacingHorizontalM, marginBottom: tokens.spacingVerticalM, minHeight: '32px' },
  muted: { color: tokens.colorNeutralForeground3 },
  notices: { display: 'grid', rowGap: tokens.spacingVerticalS, marginBottom: tokens.spacingVerticalM },
  changes: { maxHeight: '260px', overflowY: 'auto' },
  dialogGrid: { display: 'grid', rowGap: tokens.spacingVerticalM },
  wideDialog: { maxWidth: '760px', width: 'calc(100vw - 48px)' },
});

interface ConflictState {
  latestRevision: number;
  latestDesign: LinkDesignInput;
  theirChanges: DesignChange[];
  myChanges: DesignChange[];
}

/** The engineer's editor: form on the left, live results on the right, save as a new revision. */
export function DesignEditor({ link, historyAction }: { link: LinkDetail; historyAction: ReactNode }) {
  const styles = useStyles();
  const layout = useWorkspaceStyles();
  const queryClient = useQueryClient();
  const workspace = useDesignWorkspace(link.design);
  const [baseRevision, setBaseRevision] = useState(link.revision);
  const [saveOpen, setSaveOpen] = useState(false);
  const [note, setNote] = useState('');
  const [noteError, setNoteError] = useState<string | null>(null);
  const [serverErrors, setServerErrors] = useState<Record<string, string>>({});
  const [saveError, setSaveError] = useState<string | null>(null);
  const [savedRevision, setSavedRevision] = useState<number | null>(null);
  const [conflict, setConflict] = useState<ConflictState | null>(null);
  const [rebaseNotice, setRebaseNotice] = useState<{ revision: number; reapplied: string[]; overlapping: string[] } | null>(null);
  const [restoredNotice, setRestoredNotice] = useState(false);
  const saveRevision = useSaveRevision(link.id);
  // the dialogs opened from the save button give the focus back to it when they close
  const restoreFocusTarget = useRestoreFocusTarget();

  const hasChanges = workspace.changedFieldIds.length > 0;

  // Edits left in this tab by a reload come back, re-applied on the latest revision if it moved on.
  const restored = useRef(false);
  useEffect(() => {
    if (restored.current) return;
    restored.current = true;
    const stored = loadStoredDraft(link.id);
    if (!stored) return;
    if (stored.baseRevision === link.revision) {
      workspace.replaceDraft(stored.draft, link.design);
    } else {
      const result = rebaseDraft(stored.draft, stored.base, link.design);
      workspace.replaceDraft(result.draft, link.design);
      setRebaseNotice({ revision: link.revision, reapplied: result.reapplied, overlapping: result.overlapping });
    }
    setRestoredNotice(true);
  }, [link.id, link.revision, link.design, workspace]);

  useEffect(() => {
    if (!restored.current) return;
    if (hasChanges) storeDraft(link.id, { baseRevision, base: workspace.base, draft: workspace.draft });
    else clearStoredDraft(link.id);
  }, [hasChanges, link.id, baseRevision, workspace.base, workspace.draft]);
  const blocker = useBlocker(({ currentLocation, nextLocation }) => hasChanges && currentLocation.pathname !== nextLocation.pathname);

  // Leaving the page with unsaved edits asks first (reloads and closing the tab too).
  useEffect(() => {
    if (!hasChanges) return;
    const onBeforeUnload = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener('beforeunload', onBeforeUnload);
    return () => window.removeEventListener('beforeunload', onBeforeUnload);
  }, [hasChanges]);

  // A fresh edit supersedes the server's verdict on the previous attempt.
  useEffect(() => {
    setServerErrors({});
  }, [workspace.draft]);

  const errors = { ...serverErrors, ...workspace.errors };
  const pendingChanges = workspace.design ? diffDesigns(workspace.base, workspace.design) : [];

  const onSave = () => {
    if (!workspace.design) return;
    if (note.trim() === '') {
      setNoteError('Add a note: what changed and why. Reviewers read it in the history.');
      return;
    }
    setSaveError(null);
    saveRevision.mutate(
      { baseRevision, design: workspace.design, note: note.trim() },
      {
        onSuccess: (saved) => {
          workspace.replaceDraft(workspace.draft, saved.design);
          setBaseRevision(saved.revision);
          setSavedRevision(saved.revision);
          clearStoredDraft(link.id);
          setRestoredNotice(false);
          setRebaseNotice(null);
          setNote('');
          setSaveOpen(false);
        },
        onError: async (error) => {
          const found = readRevisionConflict(error);
          if (found) {
            let latestDesign = found.latestDesign;
            let latestRevision = found.latestRevision;
            if (!latestDesign) {
              const latest = await queryClient.fetchQuery({ ...getLinkQueryOptions(link.id), staleTime: 0 });
              latestDesign = latest.design;
              latestRevision = latest.revision;
            }
            setSaveOpen(false);
            setConflict({
              latestRevision,
              latestDesign,
              theirChanges: diffDesigns(workspace.base, latestDesign),
              myChanges: workspace.design ? diffDesigns(workspace.base, workspace.design) : [],
            });
            return;
          }
          const issues = apiFieldIssues(error);
          if (issues.length > 0) {
            // design fields are named by their path inside the design
            const { fieldErrors } = mapIssuesToFields(issues, (path) => {
              const fieldPath = path.replace(/^design\./, '');
              return { field: fieldPath, label: designFieldLabel(fieldPath) };
            });
            setServerErrors(fieldErrors as Record<string, string>);
            setSaveError('The server refused some values; they are marked next to their fields.');
            setSaveOpen(false);
            return;
          }
          setSaveError(error instanceof Error ? error.message : 'Saving failed.');
        },
      },
    );
  };

  const reapplyOnLatest = () => {
    if (!conflict) return;
    const result = rebaseDraft(workspace.draft, workspace.base, conflict.latestDesign);
    workspace.replaceDraft(result.draft, conflict.latestDesign);
    setBaseRevision(conflict.latestRevision);
    setRebaseNotice({ revision: conflict.latestRevision, reapplied: result.reapplied, overlapping: result.overlapping });
    setConflict(null);
    void queryClient.invalidateQueries({ queryKey: linkKeys.detail(link.id) });
  };

  const discard = () => {
    workspace.replaceDraft(draftFromDesign(workspace.base));
    clearStoredDraft(link.id);
    setRebaseNotice(null);
    setRestoredNotice(false);
  };

  return (
    <>
      <LinkHeader
        link={link}
        actions={
          <>
            {historyAction}
            {hasChanges && (
              <Button icon={<ArrowUndoRegular />} onClick={discard}>
                Discard changes
              </Button>
            )}
            <Button
              {...restoreFocusTarget}
              appearance="primary"
              icon={<SaveRegular />}
              // stays focusable once disabled: after a save, keyboard focus stays here instead of falling to the page
              disabledFocusable={!hasChanges || !workspace.design}
              onClick={() => {
                setNoteError(null);
                setSaveError(null);
                setSaveOpen(true);
              }}
            >
              Save as revision {baseRevision + 1}
            </Button>
          </>
        }
      />

      <div className={styles.statusBar} aria-live="polite">
        <Body1 className={styles.muted} data-testid="edit-status">
          {!hasChanges
            ? `No unsaved changes to revision ${baseRevision}.`
            : workspace.design
              ? `${workspace.changedFieldIds.length} field${workspace.changedFieldIds.length === 1 ? '' : 's'} changed since revision ${baseRevision}, not saved yet.`
              : `${Object.keys(workspace.errors).length} field${Object.keys(workspace.errors).length === 1 ? ' needs' : 's need'} fixing before this can be saved.`}
        </Body1>
      </div>

      {/* Save, conflict and restore notices are announced as they appear. */}
      <div className={styles.notices} role="status" aria-live="polite" data-testid="workspace-notices">
        {savedRevision !== null && (
          <MessageBar intent="success" data-testid="saved-notice">
            <MessageBarBody>Saved as revision {savedRevision}. It is a draft until submitted for review.</MessageBarBody>
            <MessageBarActions containerAction={<Button appearance="transparent" icon={<DismissRegular />} aria-label="Dismiss" onClick={() => setSavedRevision(null)} />} />
          </MessageBar>
        )}
        {saveError && !saveOpen && (
          <MessageBar intent="error">
            <MessageBarBody>{saveError}</MessageBarBody>
          </MessageBar>
        )}
        {restoredNotice && hasChanges && (
          <MessageBar intent="info" data-testid="restored-notice">
            <MessageBarBody>Your unsaved edits to this link were kept in this browser tab and are back. Save them or discard them.</MessageBarBody>
            <MessageBarActions containerAction={<Button appearance="transparent" icon={<DismissRegular />} aria-label="Dismiss" onClick={() => setRestoredNotice(false)} />} />
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
            <MessageBarActions containerAction={<Button appearance="transparent" icon={<DismissRegular />} aria-label="Dismiss" onClick={() => setRebaseNotice(null)} />} />
          </MessageBar>
        )}
      </div>

      <div className={layout.layout}>
        <DesignForm
          draft={workspace.draft}
          errors={errors}
          changedFieldIds={workspace.changedFieldIds}
          onTextChange={workspace.setText}
          onUpdate={workspace.update}
          resolved={{
            waistRadiusM: workspace.shownDesign.transmitter.waistRadiusM,
            halfAngleDivergenceRad: workspace.shownDesign.transmitter.halfAngleDivergenceRad,
            diffractionHalfAngleRad: workspace.budget?.diffractionHalfAngleRad,
          }}
          powerNote={<EyeSafetyLine design={workspace.shownDesign} budget={workspace.budget} />}
          pathExtras={
            <SitePathSummary
              siteAId={link.siteA?.id}
              siteBId={link.siteB?.id}
              designRangeM={workspace.shownDesign.rangeM}
              onUseRangeM={(rangeM) => workspace.setText('rangeM', rangeM >= 1000 ? `${Number((rangeM / 1000).toPrecision(5))} km` : `${Number(rangeM.toPrecision(4))} m`)}
            />
          }
          transmitterExtras={<EquipmentPicker kind="transmitter" onPick={(item) => item.kind === 'transmitter' && workspace.replaceDraft(applyTransmitterSpec(workspace.draft, item.spec))} />}
          receiverExtras={<EquipmentPicker kind="receiver" onPick={(item) => item.kind === 'receiver' && workspace.replaceDraft(applyReceiverSpec(workspace.draft, item.spec))} />}
        />
        <div className={layout.results}>
          <DesignResults
            design={workspace.shownDesign}
            budget={workspace.budget}
            budgetError={workspace.budgetError}
            chartDesign={workspace.chartDesign}
            stale={workspace.showingLastValid}
          />
        </div>
      </div>

      <Dialog open={saveOpen} onOpenChange={(_, data) => setSaveOpen(data.open)}>
        <DialogSurface aria-describedby="save-dialog-description" className={styles.wideDialog}>
          <DialogBody>
            <DialogTitle>Save as revision {baseRevision + 1}</DialogTitle>
            <DialogContent className={styles.dialogGrid}>
              <Body1 id="save-dialog-description">
                Revisions are never changed once saved. This one starts from revision {baseRevision} and changes:
              </Body1>
              <div className={styles.changes}>
                <ChangesTable changes={pendingChanges} beforeLabel={`Revision ${baseRevision}`} afterLabel="Now" testId="save-changes" />
              </div>
              <Field label="Note" required validationMessage={noteError ?? undefined} validationState={noteError ? 'error' : 'none'}>
                <Textarea
                  value={note}
                  onChange={(_, data) => {
                    setNote(data.value);
                    if (data.value.trim()) setNoteError(null);
                  }}
                  placeholder="e.g. Range corrected to the surveyed 2.46 km; larger receive aperture"
                  resize="vertical"
                  maxLength={2000}
                />
              </Field>
              {saveError && (
                <MessageBar intent="error">
                  <MessageBarBody>{saveError}</MessageBarBody>
                </MessageBar>
              )}
            </DialogContent>
            <DialogActions>
              <Button appearance="secondary" onClick={() => setSaveOpen(false)}>
                Keep editing
              </Button>
              <Button
                appearance="primary"
                onClick={onSave}
                disabled={saveRevision.isPending}
                icon={saveRevision.isPending ? <Spinner size="tiny" /> : <SaveRegular />}
              >
                Save revision
              </Button>
            </DialogActions>
          </DialogBody>
        </DialogSurface>
      </Dialog>

      <Dialog open={conflict !== null} modalType="alert">
        <DialogSurface className={styles.wideDialog}>
          <DialogBody>
            <DialogTitle>Revision {conflict?.latestRevision} was saved while you were editing</DialogTitle>
            <DialogContent className={styles.dialogGrid}>
              <Body1>
                Your edits started from revision {baseRevision}. Nothing you typed is lost: you can load revision {conflict?.latestRevision} and
                re-apply your edits on top of it, then check and save again.
              </Body1>
              <Caption1>What the other save changed</Caption1>
              <div className={styles.changes}>
                <ChangesTable
                  changes={conflict?.theirChanges ?? []}
                  beforeLabel={`Revision ${baseRevision}`}
                  afterLabel={`Revision ${conflict?.latestRevision}`}
                  testId="conflict-their-changes"
                />
              </div>
              <Caption1>Your edits</Caption1>
              <div className={styles.changes}>
                <ChangesTable changes={conflict?.myChanges ?? []} beforeLabel={`Revision ${baseRevision}`} afterLabel="Yours" />
              </div>
            </DialogContent>
            <DialogActions>
              <Button appearance="secondary" onClick={() => setConflict(null)}>
                Keep editing as is
              </Button>
              <Button appearance="primary" onClick={reapplyOnLatest}>
                Load revision {conflict?.latestRevision} and re-apply my edits
              </Button>
            </DialogActions>
          </DialogBody>
        </DialogSurface>
      </Dialog>

      <Dialog open={blocker.state === 'blocked'} modalType="alert">
        <DialogSurface>
          <DialogBody>
            <DialogTitle>Leave without saving?</DialogTitle>
            <DialogContent>
              {workspace.changedFieldIds.length} field{workspace.changedFieldIds.length === 1 ? ' has' : 's have'} changed since revision{' '}
              {baseRevision}. Leaving now drops these edits.
            </DialogContent>
            <DialogActions>
              <Button appearance="primary" onClick={() => blocker.reset?.()}>
                Stay and keep editing
              </Button>
              <Button onClick={() => blocker.proceed?.()}>Leave and drop the edits</Button>
            </DialogActions>
          </DialogBody>
        </DialogSurface>
      </Dialog>
    </>
  );
}

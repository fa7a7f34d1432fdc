import { useState, type ReactNode } from 'react';
import { Body1, Button, makeStyles, tokens, useRestoreFocusTarget } from '@fluentui/react-components';
import { ArrowUndoRegular, SaveRegular } from '@fluentui/react-icons';
import { REQUIRED_LINK_MARGIN_DB } from '@beamwright/link-core';
import type { LinkDetail } from '@beamwright/link-core/contracts';
import { LinkHeader } from '@/features/links/components/link-header';
import { useDesignWorkspace } from '@/features/link-design/hooks/use-design-workspace';
import { useDraftPersistence } from '@/features/link-design/hooks/use-draft-persistence';
import { useUnsavedEditsGuard } from '@/features/link-design/hooks/use-unsaved-edits-guard';
import { DesignForm } from '@/features/link-design/components/design-form';
import { DesignResults } from '@/features/link-design/components/design-results';
import { EyeSafetyLine } from '@/features/link-design/components/eye-safety-panel';
import { EditorNotices } from '@/features/link-design/components/editor-notices';
import { SaveRevisionDialog } from '@/features/link-design/components/save-revision-dialog';
import { RevisionConflictDialog } from '@/features/link-design/components/revision-conflict-dialog';
import { LeaveUnsavedDialog } from '@/features/link-design/components/leave-unsaved-dialog';
import { draftFromDesign } from '@/features/link-design/design-draft';
import { applyReceiverSpec, applyTransmitterSpec } from '@/features/link-design/catalogue-fill';
import { diffDesigns } from '@/features/link-design/design-diff';
import { EquipmentPicker } from '@/features/equipment/components/equipment-picker';
import { SitePathSummary } from '@/features/sites/components/site-path-summary';
import { useWorkspaceStyles } from '@/app/routes/links/workspace-layout';
import { useSaveDesign } from '@/app/routes/links/use-save-design';
import { ResultsTabs } from '@/app/routes/links/results-tabs';
import { sizingActions } from '@/app/routes/links/sizing-actions';
import { MarginExplorer } from '@/features/explore/components/margin-explorer';
import { AlternativesPanel } from '@/features/variants/components/alternatives-panel';
import { useVariantSet, type VariantDraft } from '@/features/variants/hooks/use-variant-set';
import { usePromoteVariant } from '@/features/variants/api/promote-variant';
import { wavelengthLabel } from '@/features/variants/wavelength-set';
import { useEquipment } from '@/features/equipment/api/get-equipment';
import { readRevisionConflict } from '@/features/links/api/save-revision';

const useStyles = makeStyles({
  statusBar: { display: 'flex', alignItems: 'center', columnGap: tokens.spacingHorizontalM, marginBottom: tokens.spacingVerticalM, minHeight: '32px' },
  muted: { color: tokens.colorNeutralForeground3 },
});

/** A range as the engineer would type it: km from 1 km on, metres below. */
const rangeText = (rangeM: number) => (rangeM >= 1000 ? `${Number((rangeM / 1000).toPrecision(5))} km` : `${Number(rangeM.toPrecision(4))} m`);

/** The engineer's editor: form on the left, live results on the right, save as a new revision. */
export function DesignEditor({ link, historyAction }: { link: LinkDetail; historyAction: ReactNode }) {
  const styles = useStyles();
  const layout = useWorkspaceStyles();
  const workspace = useDesignWorkspace(link.design);
  const variantSet = useVariantSet(link.id, link.variants, link.revision);
  const saving = useSaveDesign(link, workspace, variantSet);
  const promotion = usePromoteVariant(link.id);
  const [promoteError, setPromoteError] = useState<string | null>(null);
  const catalogue = useEquipment('transmitter').data;
  const { baseRevision } = saving;
  const kept = useDraftPersistence({ linkId: link.id, stored: link, baseRevision, workspace });
  const [saveOpen, setSaveOpen] = useState(false);
  // the dialogs opened from the save button give the focus back to it when they close
  const restoreFocusTarget = useRestoreFocusTarget();

  const changedCount = workspace.changedFieldIds.length;
  const hasChanges = changedCount > 0 || variantSet.changed;
  const blocker = useUnsavedEditsGuard(hasChanges);
  const errors = { ...saving.serverErrors, ...workspace.errors };
  const pendingChanges = [
    ...(workspace.design ? diffDesigns(workspace.base, workspace.design) : []),
    ...(variantSet.changed
      ? [{ path: 'variants', label: 'Alternatives', before: `${link.variants?.length ?? 0} stored`, after: variantSet.variants.map((variant) => variant.name.trim()).join('; ') || 'none' }]
      : []),
  ];
  const catalogueWavelengthsM = [...new Set((catalogue ?? []).flatMap((item) => (item.kind === 'transmitter' ? [item.spec.wavelengthM] : [])))];

  const promote = async (index: number) => {
    setPromoteError(null);
    try {
      const detail = await promotion.mutateAsync({ revision: saving.baseRevision, index });
      saving.adopt(detail);
      kept.forget();
    } catch (error) {
      setPromoteError(
        readRevisionConflict(error)
          ? `Revision ${saving.baseRevision} is no longer the latest: someone saved after it. Reload the link to promote from the latest revision.`
          : error instanceof Error
            ? error.message
            : 'The promotion failed.',
      );
    }
  };

  /** The alternative goes into the form; the form's design takes its place among the alternatives. */
  const swapIntoForm = (variant: VariantDraft) => {
    const current = workspace.design;
    if (!current) return;
    variantSet.replaceDesign(variant.id, variantSet.freeName(`${wavelengthLabel(current.transmitter.wavelengthM)}, ${current.transmitter.powerDbm} dBm (was in the form)`), current);
    workspace.replaceDraft(draftFromDesign(variant.design));
  };

  const onSave = async (note: string) => {
    const outcome = await saving.save(note);
    if (outcome.saved) kept.forget();
    if (!outcome.keepDialogOpen) setSaveOpen(false);
    return outcome;
  };

  const discard = () => {
    workspace.replaceDraft(draftFromDesign(workspace.base));
    variantSet.reset(link.variants, saving.baseRevision);
    kept.forget();
  };

  const invalidCount = Object.keys(workspace.errors).length;
  const alternativesNote = variantSet.changed ? (changedCount > 0 ? ' Alternatives changed too.' : ' Alternatives changed.') : '';
  const status = !hasChanges
    ? `No unsaved changes to revision ${baseRevision}.`
    : workspace.design
      ? `${changedCount > 0 ? `${changedCount} field${changedCount === 1 ? '' : 's'} changed since revision ${baseRevision}, not saved yet.` : `Not saved yet (revision ${baseRevision}).`}${alternativesNote}`
      : `${invalidCount} field${invalidCount === 1 ? ' needs' : 's need'} fixing before this can be saved.`;

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
                saving.clearSaveError();
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
          {status}
        </Body1>
      </div>

      <EditorNotices
        savedRevision={saving.savedRevision}
        onDismissSaved={saving.dismissSaved}
        saveError={saveOpen ? null : saving.saveError}
        showRestored={kept.restoredNotice && hasChanges}
        onDismissRestored={kept.dismissRestored}
        rebaseNotice={kept.rebaseNotice}
        onDismissRebase={() => kept.setRebaseNotice(null)}
      />

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
          fieldActions={sizingActions(workspace)}
          pathExtras={
            <SitePathSummary
              siteAId={link.siteA?.id}
              siteBId={link.siteB?.id}
              designRangeM={workspace.shownDesign.rangeM}
              onUseRangeM={(rangeM) => workspace.setText('rangeM', rangeText(rangeM))}
            />
          }
          transmitterExtras={<EquipmentPicker kind="transmitter" onPick={(item) => item.kind === 'transmitter' && workspace.replaceDraft(applyTransmitterSpec(workspace.draft, item.spec))} />}
          receiverExtras={<EquipmentPicker kind="receiver" onPick={(item) => item.kind === 'receiver' && workspace.replaceDraft(applyReceiverSpec(workspace.draft, item.spec))} />}
        />
        <div className={layout.results}>
          <ResultsTabs
            alternativesCount={variantSet.variants.length}
            views={{
              budget: (
                <DesignResults
                  design={workspace.shownDesign}
                  budget={workspace.budget}
                  budgetError={workspace.budgetError}
                  chartDesign={workspace.chartDesign}
                  stale={workspace.showingLastValid}
                  onUseOutagePointing={() => workspace.setText('pointing.outageProbability', '0.001')}
                />
              ),
              explore: <MarginExplorer design={workspace.chartDesign} requiredMarginDb={REQUIRED_LINK_MARGIN_DB} />,
              alternatives: (
                <AlternativesPanel
                  primaryDesign={workspace.chartDesign}
                  primaryLabel={hasChanges ? 'The form' : `Revision ${baseRevision}`}
                  requiredMarginDb={REQUIRED_LINK_MARGIN_DB}
                  variants={variantSet.variants}
                  edit={{ set: variantSet, errors: saving.variantErrors, onUseInForm: swapIntoForm, catalogueWavelengthsM }}
                  promote={{
                    revision: baseRevision,
                    unavailableReason: hasChanges ? 'Save or discard the unsaved changes first: a promotion starts from the stored revision.' : null,
                    pendingIndex: promotion.isPending ? (promotion.variables?.index ?? null) : null,
                    error: promoteError,
                    onPromote: (index) => void promote(index),
                  }}
                />
              ),
            }}
          />
        </div>
      </div>

      <SaveRevisionDialog
        open={saveOpen}
        onOpenChange={setSaveOpen}
        baseRevision={baseRevision}
        changes={pendingChanges}
        saveError={saving.saveError}
        pending={saving.pending}
        onSave={onSave}
      />
      <RevisionConflictDialog
        conflict={saving.conflict}
        baseRevision={baseRevision}
        onKeepEditing={saving.dismissConflict}
        onReapply={() => kept.setRebaseNotice(saving.reapplyOnLatest())}
      />
      <LeaveUnsavedDialog
        open={blocker.state === 'blocked'}
        changedCount={changedCount}
        baseRevision={baseRevision}
        onStay={() => blocker.reset?.()}
        onLeave={() => blocker.proceed?.()}
      />
    </>
  );
}

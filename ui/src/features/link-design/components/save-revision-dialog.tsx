import { useEffect } from 'react';
import { Controller, useForm, type FieldError } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import {
  Body1,
  Button,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  Field,
  MessageBar,
  MessageBarBody,
  Spinner,
  Textarea,
} from '@fluentui/react-components';
import { SaveRegular } from '@fluentui/react-icons';
import { CreateRevisionRequestSchema } from '@beamwright/link-core/contracts';
import { withFieldMessages } from '@/lib/form-errors';
import type { DesignChange } from '@/features/link-design/design-diff';
import { DesignChangesTable } from '@/features/link-design/components/design-changes-table';
import { useEditorDialogStyles } from '@/features/link-design/components/dialog-styles';

const NOTE_REQUIRED = 'Add a note: what changed and why. Reviewers read it in the history.';

// The save request's note rule, and one of the editor's: reviewers need to know why it changed.
const NoteFormSchema = z.object({ note: CreateRevisionRequestSchema.shape.note.unwrap().refine((note) => note !== '', NOTE_REQUIRED) });
const resolver = withFieldMessages(zodResolver(NoteFormSchema), (_field: string, error: FieldError) =>
  error.message === NOTE_REQUIRED ? NOTE_REQUIRED : `Note ${error.message}`,
);

/** What became of a save attempt, as far as the note form cares. */
export type SaveAttempt = { saved: true } | { saved: false; noteError?: string };

export interface SaveRevisionDialogProps {
  open: boolean;
  onOpenChange: (open: boolean) => void;
  baseRevision: number;
  changes: DesignChange[];
  /** why the last attempt failed, shown in the dialog */
  saveError: string | null;
  pending: boolean;
  onSave: (note: string) => Promise<SaveAttempt>;
}

/** Names the new revision, lists what changed since its base and asks for the note. */
export function SaveRevisionDialog({ open, onOpenChange, baseRevision, changes, saveError, pending, onSave }: SaveRevisionDialogProps) {
  const styles = useEditorDialogStyles();
  const form = useForm<z.input<typeof NoteFormSchema>, unknown, z.output<typeof NoteFormSchema>>({ defaultValues: { note: '' }, resolver, shouldFocusError: false });
  const { clearErrors } = form;

  // a fresh dialog shows no message from the last attempt
  useEffect(() => {
    if (open) clearErrors();
  }, [open, clearErrors]);

  const submit = form.handleSubmit(async ({ note }) => {
    const attempt = await onSave(note);
    if (attempt.saved) form.reset();
    else if (attempt.noteError) form.setError('note', { type: 'server', message: attempt.noteError });
  });

  return (
    <Dialog open={open} onOpenChange={(_, data) => onOpenChange(data.open)}>
      <DialogSurface aria-describedby="save-dialog-description" className={styles.wideDialog}>
        <DialogBody>
          <DialogTitle>Save as revision {baseRevision + 1}</DialogTitle>
          <DialogContent className={styles.dialogGrid}>
            <Body1 id="save-dialog-description">Revisions are never changed once saved. This one starts from revision {baseRevision} and changes:</Body1>
            <div className={styles.changes}>
              <DesignChangesTable changes={changes} beforeLabel={`Revision ${baseRevision}`} afterLabel="Now" testId="save-changes" />
            </div>
            <Controller
              name="note"
              control={form.control}
              render={({ field, fieldState }) => (
                <Field label="Note" required validationMessage={fieldState.error?.message} validationState={fieldState.error ? 'error' : 'none'}>
                  <Textarea
                    {...field}
                    value={field.value ?? ''}
                    onChange={(_, data) => field.onChange(data.value)}
                    placeholder="e.g. Range corrected to the surveyed 2.46 km; larger receive aperture"
                    resize="vertical"
                    maxLength={2000}
                  />
                </Field>
              )}
            />
            {saveError && (
              <MessageBar intent="error">
                <MessageBarBody>{saveError}</MessageBarBody>
              </MessageBar>
            )}
          </DialogContent>
          <DialogActions>
            <Button appearance="secondary" onClick={() => onOpenChange(false)}>
              Keep editing
            </Button>
            <Button appearance="primary" onClick={() => void submit()} disabled={pending} icon={pending ? <Spinner size="tiny" /> : <SaveRegular />}>
              Save revision
            </Button>
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}

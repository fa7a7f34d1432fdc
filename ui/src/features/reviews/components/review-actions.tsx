import { useRef, useState, type ReactElement } from 'react';
import { Controller, useForm, type FieldError } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
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
  createFocusOutlineStyle,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { ArrowReplyRegular, CheckmarkRegular, PlugConnectedRegular, SendRegular } from '@fluentui/react-icons';
import {
  ReturnRevisionRequestSchema,
  ReviewCommentRequestSchema,
  allowedReviewActions,
  type LinkStatus,
  type ReviewAction,
  type ReviewCommentRequest,
  type Role,
} from '@beamwright/link-core/contracts';
import { setApiFieldErrors, withFieldMessages } from '@/lib/form-errors';
import { useActOnRevision } from '@/features/reviews/api/act-on-revision';

const useStyles = makeStyles({
  bar: { display: 'flex', flexWrap: 'wrap', columnGap: tokens.spacingHorizontalS, rowGap: tokens.spacingVerticalS },
  dialog: { display: 'grid', rowGap: tokens.spacingVerticalM },
  outcome: {
    display: 'inline-block',
    // Fluent draws the focus ring as an ::after box around a positioned element
    position: 'relative',
    fontSize: tokens.fontSizeBase300,
    lineHeight: tokens.lineHeightBase300,
    fontWeight: tokens.fontWeightSemibold,
    borderRadius: tokens.borderRadiusSmall,
    ...createFocusOutlineStyle(),
  },
});

/** What a screen reader hears (and everyone reads) once an action went through. */
const OUTCOME_TEXT: Record<ReviewAction, (revision: number) => string> = {
  submit: (revision) => `Revision ${revision} submitted for review.`,
  approve: (revision) => `Revision ${revision} approved.`,
  return: (revision) => `Revision ${revision} returned to the engineer.`,
  install: (revision) => `Revision ${revision} recorded as installed.`,
};

interface ActionSpec {
  action: ReviewAction;
  label: string;
  title: string;
  explain: string;
  commentRequired: boolean;
  icon: ReactElement;
  appearance: 'primary' | 'secondary';
}

const ACTION_SPECS: Record<ReviewAction, ActionSpec> = {
  submit: { action: 'submit', label: 'Submit for review', title: 'Submit for review', explain: 'A reviewer will approve the revision or return it with comments.', commentRequired: false, icon: <SendRegular />, appearance: 'primary' },
  approve: { action: 'approve', label: 'Approve', title: 'Approve this revision', explain: 'Approval is recorded with your name and the time; an approved revision never changes.', commentRequired: false, icon: <CheckmarkRegular />, appearance: 'primary' },
  return: { action: 'return', label: 'Return with comment', title: 'Return to the engineer', explain: 'Say what must change; the link goes back to draft.', commentRequired: true, icon: <ArrowReplyRegular />, appearance: 'secondary' },
  install: { action: 'install', label: 'Record as installed', title: 'Record as installed', explain: 'Marks the approved revision as the one mounted and aligned on site.', commentRequired: false, icon: <PlugConnectedRegular />, appearance: 'secondary' },
};

const REQUIRED_COMMENT = 'A comment is required: tell the engineer what to change.';

/** A returned revision needs a comment (the api's own rule); the other steps take one optionally. */
function commentResolver(commentRequired: boolean) {
  const describe = (_field: string, error: FieldError) => (commentRequired && error.message === 'is required' ? REQUIRED_COMMENT : `Comment ${error.message}`);
  return withFieldMessages(zodResolver(commentRequired ? ReturnRevisionRequestSchema : ReviewCommentRequestSchema), describe);
}
const resolvers = { required: commentResolver(true), optional: commentResolver(false) };

/** The buttons the shared rules (allowedReviewActions) give this caller on this link. */
function actionsFor(role: Role | undefined, status: LinkStatus, isAuthor: boolean): ActionSpec[] {
  return allowedReviewActions(role, status, isAuthor).map((action) => ACTION_SPECS[action]);
}

/** The review step the caller's role allows on the latest revision, each with a comment. */
export function ReviewActions({
  linkId,
  revision,
  status,
  role,
  isAuthor = false,
  archived = false,
}: {
  linkId: string;
  revision: number;
  status: LinkStatus;
  role: Role | undefined;
  /** whether the caller wrote the latest revision (no approving one's own) */
  isAuthor?: boolean;
  /** an archived link takes no review steps until it is restored */
  archived?: boolean;
}) {
  const styles = useStyles();
  const act = useActOnRevision(linkId);
  const [open, setOpen] = useState<ActionSpec | null>(null);
  // the resolver follows the step being confirmed
  const openRef = useRef<ActionSpec | null>(null);
  openRef.current = open;
  const form = useForm<ReviewCommentRequest, unknown, { comment: string }>({
    defaultValues: { comment: '' },
    resolver: (values, context, options) => (openRef.current?.commentRequired ? resolvers.required : resolvers.optional)(values, context, options),
    shouldFocusError: false,
  });
  const error = form.formState.errors.root?.message ?? null;
  const [outcome, setOutcome] = useState<string | null>(null);
  const outcomeRef = useRef<HTMLSpanElement>(null);
  // The button that opened the dialog is usually gone once the status moves on: focus goes to the outcome instead.
  const focusOutcomeAfterClose = useRef(false);
  const actions = archived ? [] : actionsFor(role, status, isAuthor);

  const submit = form.handleSubmit(({ comment }) => {
    if (!open) return;
    act.mutate(
      { revision, action: open.action, comment },
      {
        onSuccess: () => {
          focusOutcomeAfterClose.current = true;
          setOutcome(OUTCOME_TEXT[open.action](revision));
          setOpen(null);
          form.reset();
        },
        onError: (failure) => {
          const mapped = setApiFieldErrors(failure, form.setError, (path) => (path === 'comment' ? { field: 'comment', label: 'Comment' } : null));
          if (!mapped || mapped.fieldCount === 0) form.setError('root', { message: failure instanceof Error ? failure.message : 'The action failed.' });
        },
      },
    );
  });

  return (
    <>
      <div role="status" aria-live="polite" data-testid="review-outcome">
        {outcome && (
          <span ref={outcomeRef} tabIndex={-1} className={styles.outcome}>
            {outcome}
          </span>
        )}
      </div>
      {actions.length > 0 && (
        <div className={styles.bar} data-testid="review-actions">
          {actions.map((spec) => (
            <Button
              key={spec.action}
              appearance={spec.appearance}
              icon={spec.icon}
              onClick={() => {
                setOpen(spec);
                setOutcome(null);
                form.clearErrors();
              }}
            >
              {spec.label}
            </Button>
          ))}
        </div>
      )}
      <Dialog
        open={open !== null}
        onOpenChange={(_, data) => !data.open && setOpen(null)}
        surfaceMotion={{
          onMotionFinish: (_, data) => {
            if (data.direction !== 'exit' || !focusOutcomeAfterClose.current) return;
            focusOutcomeAfterClose.current = false;
            outcomeRef.current?.focus();
          },
        }}
      >
        <DialogSurface>
          <DialogBody>
            <DialogTitle>
              {open?.title} (revision {revision})
            </DialogTitle>
            <DialogContent className={styles.dialog}>
              <Body1>{open?.explain}</Body1>
              <Controller
                name="comment"
                control={form.control}
                render={({ field, fieldState }) => (
                  <Field
                    label="Comment"
                    required={open?.commentRequired}
                    validationMessage={fieldState.error?.message}
                    validationState={fieldState.error ? 'error' : 'none'}
                    hint={open?.commentRequired ? undefined : 'Optional.'}
                  >
                    <Textarea {...field} value={field.value ?? ''} onChange={(_, data) => field.onChange(data.value)} resize="vertical" maxLength={4000} />
                  </Field>
                )}
              />
              {error && (
                <MessageBar intent="error">
                  <MessageBarBody>{error}</MessageBarBody>
                </MessageBar>
              )}
            </DialogContent>
            <DialogActions>
              <Button onClick={() => setOpen(null)}>Cancel</Button>
              <Button appearance="primary" onClick={() => void submit()} disabled={act.isPending} icon={act.isPending ? <Spinner size="tiny" /> : open?.icon}>
                {open?.label}
              </Button>
            </DialogActions>
          </DialogBody>
        </DialogSurface>
      </Dialog>
    </>
  );
}

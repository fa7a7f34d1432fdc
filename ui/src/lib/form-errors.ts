// Forms: react-hook-form with the zod resolver on link-core's schemas. The field names a form
// shows its messages under and the api's issue paths meet here, in one mapper.
import type { FieldError, FieldValues, Resolver } from 'react-hook-form';
import { ErrorBodySchema, type ErrorIssue } from '@beamwright/link-core/contracts';
import { isApiError } from '@/lib/api-client';

/** The field-level problems of a 400, read with the contract's error schema; [] for anything else. */
export function apiFieldIssues(error: unknown): ErrorIssue[] {
  if (!isApiError(error, 400)) return [];
  const body = ErrorBodySchema.safeParse(error.body);
  return body.success ? (body.data.issues ?? []) : [];
}

/**
 * Where an api issue path lands in a form (`null`: the form has no field for it). With a label the
 * message reads "<label> <reason>"; without one, the reason alone (a form whose api speaks in sentences).
 */
export type IssueTarget<Field extends string> = { field: Field; label?: string } | null;

export interface MappedIssues<Field extends string> {
  /** per field, the message to show beside it (the first issue of the field wins) */
  fieldErrors: Partial<Record<Field, string>>;
  /** issues no field of the form takes: show them above the form */
  unmatched: ErrorIssue[];
}

/**
 * The one issues → field-errors mapper: each `issues[].path` of the api's 400 is named a field of
 * the form by `targetOf`, and its reason is written after the field's label, as the api's messages
 * never repeat the field name.
 */
export function mapIssuesToFields<Field extends string>(issues: readonly ErrorIssue[], targetOf: (path: string) => IssueTarget<Field>): MappedIssues<Field> {
  const fieldErrors: Partial<Record<Field, string>> = {};
  const unmatched: ErrorIssue[] = [];
  for (const issue of issues) {
    const target = targetOf(issue.path);
    if (!target) unmatched.push(issue);
    else fieldErrors[target.field] ??= target.label ? `${target.label} ${issue.message}` : issue.message;
  }
  return { fieldErrors, unmatched };
}

/**
 * Puts a refused request's field issues on the form (`setError` of react-hook-form). Returns how
 * many fields took one and the issues no field took, or null when the error was not a 400 with
 * field issues (the caller shows its message above the form).
 */
export function setApiFieldErrors<Field extends string>(
  error: unknown,
  setError: (field: Field, error: { type: string; message: string }) => void,
  targetOf: (path: string) => IssueTarget<Field>,
): { fieldCount: number; unmatched: ErrorIssue[] } | null {
  const issues = apiFieldIssues(error);
  if (issues.length === 0) return null;
  const { fieldErrors, unmatched } = mapIssuesToFields(issues, targetOf);
  const entries = Object.entries(fieldErrors) as [Field, string][];
  for (const [field, message] of entries) setError(field, { type: 'server', message });
  return { fieldCount: entries.length, unmatched };
}

/**
 * Words the form's own checks in the form's voice: the schema's reasons ("is required") become the
 * text shown beside the field (`describe(field, error)`), so the field and the api read alike.
 */
export function withFieldMessages<Values extends FieldValues, Context, Output>(
  resolver: Resolver<Values, Context, Output>,
  describe: (field: string, error: FieldError) => string,
): Resolver<Values, Context, Output> {
  return async (values, context, options) => {
    const result = await resolver(values, context, options);
    const errors = Object.fromEntries(
      Object.entries(result.errors).map(([field, error]) => [field, { ...(error as FieldError), message: describe(field, error as FieldError) }]),
    );
    return { ...result, errors } as Awaited<ReturnType<Resolver<Values, Context, Output>>>;
  };
}

/** "<label> <reason>", the usual wording of a field's message. */
export const labelledMessage = (labels: Record<string, string>) => (field: string, error: FieldError) =>
  `${labels[field] ?? field} ${error.message ?? 'is not valid'}`;

/**
 * The error body every API error answers with (an exception filter builds it), so a client can
 * put each `issues[].message` beside the field named by `issues[].path`.
 */
import { z } from 'zod';

export const ErrorIssueSchema = z.object({
  /** dotted field path, e.g. `design.transmitter.wavelengthM`; '' for the whole body */
  path: z.string(),
  /** the reason, in words a user understands */
  message: z.string(),
});
export type ErrorIssue = z.infer<typeof ErrorIssueSchema>;

export const ErrorBodySchema = z.object({
  /** the HTTP status, repeated in the body for clients that log bodies only */
  statusCode: z.number().int(),
  /** the status text, e.g. "Bad Request" */
  error: z.string(),
  /** one sentence for a person */
  message: z.string(),
  /** present on validation errors (400): one entry per invalid field */
  issues: z.array(ErrorIssueSchema).optional(),
});
export type ErrorBody = z.infer<typeof ErrorBodySchema>;

/** The review trail of a link: who submitted, approved, returned or marked a revision installed. */
import { z } from 'zod';
import { UserRefSchema } from './auth.contract.js';
import { IsoDateTimeSchema, textField } from './common.contract.js';
import { LinkStatusSchema } from './links.contract.js';

export const REVIEW_ACTIONS = ['submit', 'approve', 'return', 'install'] as const;
export const ReviewActionSchema = z.enum(REVIEW_ACTIONS);
export type ReviewAction = z.infer<typeof ReviewActionSchema>;

/**
 * Every kind of entry on a link's trail: the review actions above, and the changes that touch
 * what an approval covered (written by the api, never requested directly): `renamed`,
 * `path_changed` (its sites, or a site's position or heights), `archived`, `restored`.
 */
export const TRAIL_ACTIONS = [...REVIEW_ACTIONS, 'renamed', 'path_changed', 'archived', 'restored'] as const;
export const TrailActionSchema = z.enum(TRAIL_ACTIONS);
export type TrailAction = z.infer<typeof TrailActionSchema>;

/** Body of submit, approve and install: an optional comment. */
export const ReviewCommentRequestSchema = z.strictObject({ comment: textField({ max: 4000, multiline: true }).default('') });
export type ReviewCommentRequest = z.input<typeof ReviewCommentRequestSchema>;

/** Body of return: the comment is required, it tells the engineer what to change. */
export const ReturnRevisionRequestSchema = z.strictObject({ comment: textField({ min: 1, max: 4000, multiline: true }) });
export type ReturnRevisionRequest = z.input<typeof ReturnRevisionRequestSchema>;

export const ReviewEntrySchema = z.object({
  id: z.uuid(),
  linkId: z.uuid(),
  revision: z.number().int().min(1),
  action: TrailActionSchema,
  fromStatus: LinkStatusSchema,
  toStatus: LinkStatusSchema,
  comment: z.string(),
  actor: UserRefSchema,
  createdAt: IsoDateTimeSchema,
});
export type ReviewEntry = z.infer<typeof ReviewEntrySchema>;

export const ReviewListResponseSchema = z.object({ items: z.array(ReviewEntrySchema) });
export type ReviewListResponse = z.infer<typeof ReviewListResponseSchema>;

/** Answer to a review action: the link's new status and the trail entry it made. */
export const ReviewActionResponseSchema = z.object({ status: LinkStatusSchema, review: ReviewEntrySchema });
export type ReviewActionResponse = z.infer<typeof ReviewActionResponseSchema>;

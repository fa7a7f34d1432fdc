import type { LinkStatus, ReviewAction } from '@beamwright/link-core/contracts';

/** Which status each review action starts from and leads to (the link's status is its latest revision's). */
export const REVIEW_TRANSITIONS: Record<ReviewAction, { from: LinkStatus; to: LinkStatus; verb: string }> = {
  submit: { from: 'draft', to: 'in_review', verb: 'submitted for review' },
  approve: { from: 'in_review', to: 'approved', verb: 'approved' },
  return: { from: 'in_review', to: 'draft', verb: 'returned' },
  install: { from: 'approved', to: 'installed', verb: 'marked installed' },
};

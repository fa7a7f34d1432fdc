/**
 * The workflow rules of Beamwright in one place: which role may do each action, how the review
 * moves a link between statuses, and when a link may be deleted or must be archived. The api's
 * guards and services, the ui's buttons and the OpenAPI document all read this table, so the
 * three never disagree. Pure data and functions, no framework imports.
 *
 * Separation of duties (common practice for design sign-off): the engineer who designs a link
 * never approves it, the reviewer who approves it never installs it, and the administrator runs
 * the organisation (members, settings) rather than the designs.
 */
import type { Role } from './auth.contract.js';
import type { LinkStatus } from './links.contract.js';
import type { ReviewAction } from './reviews.contract.js';

/** Every guarded action of the api, by name. Reading is open to every member of the organisation. */
export const PERMISSIONS = {
  /** create a link (revision 1) */
  'link.create': ['engineer'],
  /** rename a link or change its sites */
  'link.update': ['engineer'],
  /** save a new revision of a link's design */
  'link.revise': ['engineer'],
  /** promote a variant of the latest revision: it becomes the design of the next revision (a save, so the roles of 'link.revise') */
  'variant.promote': ['engineer'],
  /** submit the latest revision for review */
  'review.submit': ['engineer'],
  /** approve the latest revision (never one's own) */
  'review.approve': ['reviewer'],
  /** return the latest revision to the engineer with a comment */
  'review.return': ['reviewer'],
  /** record that the approved revision is mounted and aligned */
  'review.install': ['installer'],
  /** delete a never-approved draft (its owner only) */
  'link.delete': ['engineer'],
  /** archive a link or restore it from the archive */
  'link.archive': ['engineer'],
  /** sites are reference data shared by the organisation's links */
  'site.write': ['engineer', 'admin'],
  /** the equipment catalogue, reference data like the sites */
  'equipment.write': ['engineer', 'admin'],
  /** members, roles and organisation settings (screens still to come) */
  'organisation.manage': ['admin'],
} as const satisfies Record<string, readonly Role[]>;

export type PermissionAction = keyof typeof PERMISSIONS;
export const PERMISSION_ACTIONS = Object.keys(PERMISSIONS) as PermissionAction[];

/** The roles that may perform `action`. */
export function rolesFor(action: PermissionAction): readonly Role[] {
  return PERMISSIONS[action];
}

/** Whether `role` may perform `action` (false for a caller without a role). */
export function isAllowed(role: Role | undefined, action: PermissionAction): boolean {
  return role !== undefined && (PERMISSIONS[action] as readonly Role[]).includes(role);
}

/** Which status each review action starts from and leads to (the link's status is its latest revision's). */
export const REVIEW_TRANSITIONS: Record<ReviewAction, { from: LinkStatus; to: LinkStatus; verb: string; permission: PermissionAction }> = {
  submit: { from: 'draft', to: 'in_review', verb: 'submitted for review', permission: 'review.submit' },
  approve: { from: 'in_review', to: 'approved', verb: 'approved', permission: 'review.approve' },
  return: { from: 'in_review', to: 'draft', verb: 'returned', permission: 'review.return' },
  install: { from: 'approved', to: 'installed', verb: 'marked installed', permission: 'review.install' },
};

/**
 * The review actions `role` may take now on a link in `status`; `isAuthor` says whether the caller
 * wrote the latest revision (an author never approves their own revision, though a reviewer who
 * wrote it may still return it).
 */
export function allowedReviewActions(role: Role | undefined, status: LinkStatus, isAuthor: boolean): ReviewAction[] {
  return (Object.keys(REVIEW_TRANSITIONS) as ReviewAction[]).filter((action) => {
    const transition = REVIEW_TRANSITIONS[action];
    if (transition.from !== status || !isAllowed(role, transition.permission)) return false;
    return !(action === 'approve' && isAuthor);
  });
}

/** Why a review action is not allowed, or null when it is: `role` (403), `author` (403) or `status` (409). */
export function reviewActionRefusal(role: Role | undefined, status: LinkStatus, isAuthor: boolean, action: ReviewAction): 'role' | 'author' | 'status' | null {
  if (allowedReviewActions(role, status, isAuthor).includes(action)) return null;
  if (!isAllowed(role, REVIEW_TRANSITIONS[action].permission)) return 'role';
  if (action === 'approve' && isAuthor && status === REVIEW_TRANSITIONS.approve.from) return 'author';
  return 'status';
}

/** What the caller may do to a whole link: delete it, archive it, or restore it from the archive. */
export interface LinkLifecycleFacts {
  status: LinkStatus;
  /** whether any revision of the link was ever approved */
  wasApproved: boolean;
  archived: boolean;
  /** whether the caller owns the link */
  isOwner: boolean;
}

/**
 * Delete or archive: a draft that was never approved is scratch work and may be deleted by its
 * owner; anything that was approved, is in review or installed is part of the record and is
 * archived instead (kept readable, hidden from the default list).
 */
export function isDeletableLink(facts: Pick<LinkLifecycleFacts, 'status' | 'wasApproved'>): boolean {
  return facts.status === 'draft' && !facts.wasApproved;
}

export function allowedLinkActions(role: Role | undefined, facts: LinkLifecycleFacts): { delete: boolean; archive: boolean; restore: boolean; edit: boolean } {
  const archives = isAllowed(role, 'link.archive');
  return {
    delete: isAllowed(role, 'link.delete') && facts.isOwner && isDeletableLink(facts),
    archive: archives && !facts.archived,
    restore: archives && facts.archived,
    edit: isAllowed(role, 'link.revise') && !facts.archived,
  };
}

/**
 * What an approved or installed link allows of a change of its name or sites. An approval covers
 * the link as approved, its name and ends included: on a link in review or approved, the change
 * is accepted and sends the link back to draft (a new review); on an installed link a rename is
 * accepted (nothing moved), a change of sites is refused (the terminals are on the roofs).
 * Every accepted change on a link past draft is written to the review trail.
 */
export function linkChangeOutcome(status: LinkStatus, change: { renamed: boolean; sitesChanged: boolean }): 'silent' | 'recorded' | 'back_to_draft' | 'refused' {
  if (!change.renamed && !change.sitesChanged) return 'silent';
  if (status === 'draft') return 'silent';
  if (status === 'installed') return change.sitesChanged ? 'refused' : 'recorded';
  return 'back_to_draft';
}

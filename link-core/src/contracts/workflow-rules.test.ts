import { describe, expect, it } from 'vitest';
import { ROLES, type Role } from './auth.contract.js';
import type { LINK_STATUSES } from './links.contract.js';
import {
  allowedLinkActions,
  allowedReviewActions,
  isAllowed,
  linkChangeOutcome,
  PERMISSION_ACTIONS,
  reviewActionRefusal,
  type PermissionAction,
} from './workflow-rules.js';

// The table the README's role section states, written out in full so a change to the rules is a
// deliberate change to this test too. Columns: admin, engineer, reviewer, installer.
const EXPECTED: Record<PermissionAction, [admin: boolean, engineer: boolean, reviewer: boolean, installer: boolean]> = {
  'link.create': [false, true, false, false],
  'link.update': [false, true, false, false],
  'link.revise': [false, true, false, false],
  'variant.promote': [false, true, false, false],
  'review.submit': [false, true, false, false],
  'review.approve': [false, false, true, false],
  'review.return': [false, false, true, false],
  'review.install': [false, false, false, true],
  'link.delete': [false, true, false, false],
  'link.archive': [false, true, false, false],
  'site.write': [true, true, false, false],
  'equipment.write': [true, true, false, false],
  'organisation.manage': [true, false, false, false],
};

describe('workflow rules: who may do what', () => {
  it('matches the role table cell by cell', () => {
    expect(PERMISSION_ACTIONS.sort()).toEqual(Object.keys(EXPECTED).sort());
    for (const action of PERMISSION_ACTIONS) {
      const row = ROLES.map((role) => isAllowed(role, action));
      expect(row, action).toEqual(ROLES.map((role) => EXPECTED[action][['admin', 'engineer', 'reviewer', 'installer'].indexOf(role)]));
    }
    expect(isAllowed(undefined, 'link.create')).toBe(false);
  });

  it('lets exactly the roles that save a revision promote a variant (a promotion saves revision n+1)', () => {
    expect(ROLES.filter((role) => isAllowed(role, 'variant.promote'))).toEqual(ROLES.filter((role) => isAllowed(role, 'link.revise')));
  });

  it('keeps every review step with one role, and the admin out of all of them', () => {
    for (const action of ['review.submit', 'review.approve', 'review.return', 'review.install'] as const) {
      expect(ROLES.filter((role) => isAllowed(role, action))).toHaveLength(1);
      expect(isAllowed('admin', action)).toBe(false);
    }
  });

  // role, status, isAuthor -> the review actions offered
  const REVIEW_CASES: [Role, (typeof LINK_STATUSES)[number], boolean, string[]][] = [
    ['engineer', 'draft', true, ['submit']],
    ['engineer', 'draft', false, ['submit']],
    ['engineer', 'in_review', true, []],
    ['reviewer', 'draft', false, []],
    ['reviewer', 'in_review', false, ['approve', 'return']],
    ['reviewer', 'in_review', true, ['return']],
    ['reviewer', 'approved', false, []],
    ['installer', 'approved', false, ['install']],
    ['installer', 'installed', false, []],
    ['admin', 'draft', false, []],
    ['admin', 'in_review', false, []],
    ['admin', 'approved', false, []],
  ];
  it.each(REVIEW_CASES)('offers a %s on a %s link (author: %s) exactly %j', (role, status, isAuthor, expected) => {
    expect(allowedReviewActions(role, status, isAuthor)).toEqual(expected);
  });

  it('says why a review action is refused: role (403), own revision (403) or status (409)', () => {
    expect(reviewActionRefusal('admin', 'in_review', false, 'approve')).toBe('role');
    expect(reviewActionRefusal('reviewer', 'in_review', true, 'approve')).toBe('author');
    expect(reviewActionRefusal('reviewer', 'approved', false, 'approve')).toBe('status');
    expect(reviewActionRefusal('installer', 'draft', false, 'install')).toBe('status');
    expect(reviewActionRefusal('engineer', 'draft', false, 'submit')).toBeNull();
  });

  it('lets an owner delete only a never-approved draft, and any engineer archive or restore', () => {
    const draft = { status: 'draft' as const, wasApproved: false, archived: false, isOwner: true };
    expect(allowedLinkActions('engineer', draft)).toEqual({ delete: true, archive: true, restore: false, edit: true });
    expect(allowedLinkActions('engineer', { ...draft, isOwner: false }).delete).toBe(false);
    expect(allowedLinkActions('engineer', { ...draft, wasApproved: true }).delete).toBe(false);
    expect(allowedLinkActions('engineer', { ...draft, status: 'in_review' }).delete).toBe(false);
    expect(allowedLinkActions('engineer', { ...draft, archived: true })).toEqual({ delete: true, archive: false, restore: true, edit: false });
    expect(allowedLinkActions('admin', draft)).toEqual({ delete: false, archive: false, restore: false, edit: false });
    expect(allowedLinkActions('reviewer', { ...draft, archived: true }).restore).toBe(false);
  });

  it('sends a renamed or moved link back to review, refuses moving an installed one', () => {
    const cases: [(typeof LINK_STATUSES)[number], boolean, boolean, string][] = [
      ['draft', true, true, 'silent'],
      ['in_review', true, false, 'back_to_draft'],
      ['approved', false, true, 'back_to_draft'],
      ['approved', true, false, 'back_to_draft'],
      ['installed', true, false, 'recorded'],
      ['installed', false, true, 'refused'],
      ['installed', true, true, 'refused'],
      ['approved', false, false, 'silent'],
    ];
    for (const [status, renamed, sitesChanged, outcome] of cases) expect(linkChangeOutcome(status, { renamed, sitesChanged }), `${status} ${renamed} ${sitesChanged}`).toBe(outcome);
  });
});

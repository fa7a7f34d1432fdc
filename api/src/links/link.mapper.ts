import { currentEngineFigures } from '@beamwright/link-core';
import type {
  Approval,
  CurrentEngine,
  LinkDetail,
  LinkSummary,
  ReviewEntry,
  Revision,
  RevisionSummary,
  RevisionVariant,
  SiteRef,
  UserRef,
} from '@beamwright/link-core/contracts';
import type { Site } from '../sites/site.entity.js';
import type { User } from '../users/user.entity.js';
import type { LinkReview } from './link-review.entity.js';
import type { LinkRevision } from './link-revision.entity.js';
import type { LinkRevisionVariant } from './link-revision-variant.entity.js';
import type { Link } from './link.entity.js';

export function toUserRef(user: User | undefined, fallbackId: string): UserRef {
  return { id: user?.id ?? fallbackId, displayName: user?.displayName ?? 'Unknown user' };
}

function toSiteRef(site: Site | null | undefined): SiteRef | null {
  return site ? { id: site.id, name: site.name } : null;
}

/**
 * Needs `owner`, `siteA` and `siteB` loaded. `latest` (the latest revision) is read only for an
 * approved or installed link: the list flags those whose current-engine margin is below the
 * required one.
 */
export function toLinkSummary(link: Link, latest?: LinkRevision): LinkSummary {
  const signedOff = link.status === 'approved' || link.status === 'installed';
  const currentEngine: CurrentEngine | null =
    signedOff && latest ? currentEngineFigures(latest.design, latest.linkCoreVersion, latest.budget.linkMarginDb) : null;
  return {
    id: link.id,
    name: link.name,
    status: link.status,
    revision: link.latestRevision,
    owner: toUserRef(link.owner, link.ownerId),
    siteA: toSiteRef(link.siteA),
    siteB: toSiteRef(link.siteB),
    linkMarginDb: link.latestLinkMarginDb,
    receivedPowerDbm: link.latestReceivedPowerDbm,
    rangeM: link.latestRangeM,
    wavelengthM: link.latestWavelengthM,
    pathChangedAt: link.pathChangedAt?.toISOString() ?? null,
    changedSinceApproval: link.pathChangedAt !== null,
    archivedAt: link.archivedAt?.toISOString() ?? null,
    archived: link.archivedAt !== null,
    currentEngine,
    createdAt: link.createdAt.toISOString(),
    updatedAt: link.updatedAt.toISOString(),
  };
}

/** A stored variant, read like its revision: the stored budget, the current engine's margin beside an older one. */
export function toRevisionVariant(variant: LinkRevisionVariant): RevisionVariant {
  return {
    index: variant.position,
    name: variant.name,
    design: variant.design,
    budget: variant.budget,
    linkCoreVersion: variant.linkCoreVersion,
    currentEngine: currentEngineFigures(variant.design, variant.linkCoreVersion, variant.budget.linkMarginDb),
  };
}

/** Needs the revision's `author` loaded; `variants` are the revision's, in position order. */
export function toRevision(revision: LinkRevision, approval: Approval | null, variants: readonly LinkRevisionVariant[]): Revision {
  return {
    linkId: revision.linkId,
    revision: revision.revisionNumber,
    design: revision.design,
    budget: revision.budget,
    linkCoreVersion: revision.linkCoreVersion,
    // An older engine's revision keeps its stored budget; the current engine's margin goes beside it.
    currentEngine: currentEngineFigures(revision.design, revision.linkCoreVersion, revision.budget.linkMarginDb),
    note: revision.note,
    author: toUserRef(revision.author, revision.authorId),
    createdAt: revision.createdAt.toISOString(),
    approval,
    variants: variants.map(toRevisionVariant),
  };
}

export function toRevisionSummary(revision: LinkRevision, approval: Approval | null, variantCount: number): RevisionSummary {
  const { design: _design, budget: _budget, variants: _variants, ...rest } = toRevision(revision, approval, []);
  return {
    ...rest,
    linkMarginDb: revision.budget.linkMarginDb,
    receivedPowerDbm: revision.budget.receivedPowerDbm,
    rangeM: revision.design.rangeM,
    wavelengthM: revision.design.transmitter.wavelengthM,
    variantCount,
  };
}

/**
 * `approval` is the latest revision's; it shows only while the link is approved or installed.
 * `variants` are the latest revision's.
 */
export function toLinkDetail(link: Link, latest: LinkRevision, approval: Approval | null, wasApproved: boolean, variants: readonly LinkRevisionVariant[]): LinkDetail {
  const current = link.status === 'approved' || link.status === 'installed' ? approval : null;
  const revision = toRevision(latest, current, variants);
  return {
    ...toLinkSummary(link),
    design: revision.design,
    budget: revision.budget,
    linkCoreVersion: revision.linkCoreVersion,
    currentEngine: revision.currentEngine,
    note: revision.note,
    author: revision.author,
    revisedAt: revision.createdAt,
    approval: current,
    wasApproved,
    variants: revision.variants,
  };
}

/** Needs `actor` loaded. */
export function toReviewEntry(review: LinkReview): ReviewEntry {
  return {
    id: review.id,
    linkId: review.linkId,
    revision: review.revisionNumber,
    action: review.action,
    fromStatus: review.fromStatus,
    toStatus: review.toStatus,
    comment: review.comment,
    actor: toUserRef(review.actor, review.actorId),
    createdAt: review.createdAt.toISOString(),
  };
}

export function approvalFrom(review: LinkReview | null | undefined): Approval | null {
  return review ? { by: toUserRef(review.actor, review.actorId), at: review.createdAt.toISOString() } : null;
}

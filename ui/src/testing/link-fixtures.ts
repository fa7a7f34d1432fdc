import { LinkDesignSchema, evaluateLink, type LinkDesignInput } from '@beamwright/link-core';
import type { LinkDetail, Revision } from '@beamwright/link-core/contracts';
import { demoEngineer } from '@/testing/test-utils';
import { workedExampleDesign } from '@/testing/designs';

export const LINK_ID = '0b7f5f1e-5a1c-4c55-9d0a-3e1d2a4b5c6d';

export function revisionOf(design: LinkDesignInput, revision: number, note = `revision ${revision}`): Revision {
  const parsed = LinkDesignSchema.parse(design);
  return {
    linkId: LINK_ID,
    revision,
    design: parsed,
    budget: evaluateLink(parsed),
    linkCoreVersion: '0.1.0',
    note,
    author: { id: demoEngineer.user.id, displayName: demoEngineer.user.displayName },
    createdAt: '2026-11-30T10:00:00.000Z',
    approval: null,
  };
}

export function linkDetailOf(design: LinkDesignInput = workedExampleDesign, revision = 2, status: LinkDetail['status'] = 'draft'): LinkDetail {
  const stored = revisionOf(design, revision);
  return {
    id: LINK_ID,
    name: 'Quay office to pumping station',
    status,
    revision,
    owner: stored.author,
    siteA: null,
    siteB: null,
    linkMarginDb: stored.budget.linkMarginDb,
    receivedPowerDbm: stored.budget.receivedPowerDbm,
    rangeM: stored.design.rangeM,
    wavelengthM: stored.design.transmitter.wavelengthM,
    pathChangedAt: null,
    changedSinceApproval: false,
    archivedAt: null,
    archived: false,
    createdAt: '2026-11-01T10:00:00.000Z',
    updatedAt: stored.createdAt,
    design: stored.design,
    budget: stored.budget,
    linkCoreVersion: stored.linkCoreVersion,
    note: stored.note,
    author: stored.author,
    revisedAt: stored.createdAt,
    approval: null,
    wasApproved: status === 'approved' || status === 'installed',
  };
}

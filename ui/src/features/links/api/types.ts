// Response shapes of the links api. They follow the planner contract of
// @beamwright/link-core/contracts; kept here as the UI's view until that contract is imported.
import type { LinkBudget, LinkDesignInput } from '@beamwright/link-core';

export type LinkStatus = 'draft' | 'in_review' | 'approved' | 'installed';

export interface UserSummary {
  id: string;
  displayName: string;
}

export interface SiteSummary {
  id: string;
  name: string;
}

export interface LinkSummary {
  id: string;
  name: string;
  status: LinkStatus;
  latestRevision: number;
  rangeM: number;
  wavelengthM: number;
  linkMarginDb: number;
  siteA?: SiteSummary | null;
  siteB?: SiteSummary | null;
  owner?: UserSummary | null;
  updatedAt: string;
}

export interface Paged<Item> {
  items: Item[];
  total: number;
  page: number;
  pageSize: number;
}

export interface RevisionSummary {
  revision: number;
  note: string | null;
  author: UserSummary | null;
  createdAt: string;
  linkCoreVersion: string;
  linkMarginDb?: number;
  reviewState?: string | null;
}

export interface Revision extends RevisionSummary {
  design: LinkDesignInput;
  budget: LinkBudget;
}

export interface LinkDetail extends LinkSummary {
  revision: Revision;
}

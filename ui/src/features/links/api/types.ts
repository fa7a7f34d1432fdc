// The links api speaks the planner contract of @beamwright/link-core/contracts (type-only imports:
// nothing of the contracts' runtime lands in the bundle).
export type {
  DesignChange,
  LinkDetail,
  LinkListResponse,
  LinkStatus,
  LinkSummary,
  Revision,
  RevisionConflictBody,
  RevisionDiffResponse,
  RevisionListResponse,
  RevisionSummary,
  ReviewEntry,
  ReviewListResponse,
  ReviewActionResponse,
  SiteResponse,
  EquipmentResponse,
  EquipmentListResponse,
  SiteListResponse,
} from '@beamwright/link-core/contracts';

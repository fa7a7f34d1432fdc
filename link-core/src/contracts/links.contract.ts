/**
 * Links, their immutable revisions, the review trail and revision diffs. A link's design lives in
 * revisions: saving creates revision n+1 on top of `baseRevision` n, or answers 409 with the
 * latest revision when someone saved first.
 */
import { z } from 'zod';
import { LinkDesignSchema } from '../schemas/link-design.schema.js';
import { LinkBudgetSchema } from '../schemas/link-budget.schema.js';
import { UserRefSchema } from './auth.contract.js';
import { ErrorBodySchema } from './error.contract.js';
import { IsoDateTimeSchema, pageOf, queryInteger, textField } from './common.contract.js';
import { VariantsRequestSchema } from './variants.contract.js';

/** draft -> in_review -> approved -> installed; a new revision puts the link back to draft. */
export const LINK_STATUSES = ['draft', 'in_review', 'approved', 'installed'] as const;
export const LinkStatusSchema = z.enum(LINK_STATUSES, { error: `must be one of ${LINK_STATUSES.join(', ')}` });
export type LinkStatus = z.infer<typeof LinkStatusSchema>;
/** Each status as a label on screen: badges, filters, tables. */
export const LINK_STATUS_LABELS: Record<LinkStatus, string> = { draft: 'Draft', in_review: 'In review', approved: 'Approved', installed: 'Installed' };
/** Each status inside a sentence: "The link is in review", "only a link that is a draft …". */
export const LINK_STATUS_PHRASES: Record<LinkStatus, string> = { draft: 'a draft', in_review: 'in review', approved: 'approved', installed: 'installed' };

const optionalSiteId = z.uuid({ error: 'must be a site id (UUID)' }).nullable().optional();

export const CreateLinkRequestSchema = z.strictObject({
  name: textField({ min: 1, max: 200 }),
  design: LinkDesignSchema,
  /** the two ends; optional, a link may start from a range only */
  siteAId: optionalSiteId,
  siteBId: optionalSiteId,
  /** note of revision 1 */
  note: textField({ max: 2000, multiline: true }).default(''),
  /** named alternatives of the design, saved with revision 1 (variants.contract.ts) */
  variants: VariantsRequestSchema,
});
export type CreateLinkRequest = z.input<typeof CreateLinkRequestSchema>;

export const CreateRevisionRequestSchema = z.strictObject({
  /** the revision the edit started from; must still be the latest, else 409 */
  baseRevision: z
    .number({ error: (issue) => (issue.input === undefined ? 'is required' : 'must be a whole number') })
    .int('must be a whole number')
    .min(1, 'must be at least 1'),
  design: LinkDesignSchema,
  note: textField({ max: 2000, multiline: true }).default(''),
  /**
   * named alternatives of the design, saved with this revision (at most 8, names unique regardless
   * of case; variants.contract.ts). A revision carries only the variants its body sends: send the
   * previous revision's again to keep them.
   */
  variants: VariantsRequestSchema,
});
export type CreateRevisionRequest = z.input<typeof CreateRevisionRequestSchema>;

/** Name and ends of a link; not revisioned (the design is). */
export const UpdateLinkRequestSchema = z.strictObject({
  name: textField({ min: 1, max: 200 }).optional(),
  siteAId: optionalSiteId,
  siteBId: optionalSiteId,
});
export type UpdateLinkRequest = z.input<typeof UpdateLinkRequestSchema>;

export const LINK_SORT_FIELDS = ['name', 'status', 'updatedAt', 'createdAt', 'linkMarginDb', 'rangeM', 'wavelengthM'] as const;

export const LINK_ARCHIVED_FILTERS = ['exclude', 'include', 'only'] as const;
export type LinkArchivedFilter = (typeof LINK_ARCHIVED_FILTERS)[number];

export const LinkListQuerySchema = z.strictObject({
  page: queryInteger({ min: 1, max: 100_000, fallback: 1 }),
  pageSize: queryInteger({ min: 1, max: 100, fallback: 20 }),
  sort: z.enum(LINK_SORT_FIELDS, { error: `must be one of ${LINK_SORT_FIELDS.join(', ')}` }).default('updatedAt'),
  order: z.enum(['asc', 'desc'], { error: 'must be asc or desc' }).default('desc'),
  status: LinkStatusSchema.optional(),
  /** links with this site at either end */
  siteId: z.uuid({ error: 'must be a site id (UUID)' }).optional(),
  /** case-insensitive text in the link's name or its sites' names */
  q: textField({ max: 200 }).optional(),
  /** archived links: left out when absent (or `exclude`), listed with the others (`include`) or alone (`only`) */
  archived: z.enum(LINK_ARCHIVED_FILTERS, { error: `must be one of ${LINK_ARCHIVED_FILTERS.join(', ')}` }).optional(),
});
export type LinkListQuery = z.input<typeof LinkListQuerySchema>;

export const SiteRefSchema = z.object({ id: z.uuid(), name: z.string() });
export type SiteRef = z.infer<typeof SiteRefSchema>;

export const ApprovalSchema = z.object({ by: UserRefSchema, at: IsoDateTimeSchema });
export type Approval = z.infer<typeof ApprovalSchema>;

/**
 * The current engine's figures beside a revision computed by an older engine (null when the
 * revision's own engine is the current one). The stored budget is never recomputed in place.
 */
export const CurrentEngineSchema = z.object({
  linkCoreVersion: z.string(),
  linkMarginDb: z.number(),
  receivedPowerDbm: z.number(),
  /** current minus stored margin [dB] */
  marginChangeDb: z.number(),
  /** the current engine's margin is below the required 3 dB */
  belowRequiredMargin: z.boolean(),
});
export type CurrentEngine = z.infer<typeof CurrentEngineSchema>;

/** One row of the links table: the link with figures of its latest revision. */
export const LinkSummarySchema = z.object({
  id: z.uuid(),
  name: z.string(),
  status: LinkStatusSchema,
  /** number of the latest revision */
  revision: z.number().int().min(1),
  owner: UserRefSchema,
  siteA: SiteRefSchema.nullable(),
  siteB: SiteRefSchema.nullable(),
  linkMarginDb: z.number(),
  receivedPowerDbm: z.number(),
  rangeM: z.number(),
  wavelengthM: z.number(),
  /**
   * when a site under this approved or installed link last moved or changed height since its
   * approval; null when nothing changed (cleared by the next approval)
   */
  pathChangedAt: IsoDateTimeSchema.nullable(),
  /** `pathChangedAt !== null`: the approval no longer covers the path as it is */
  changedSinceApproval: z.boolean(),
  /** when the link was archived; null while it is not */
  archivedAt: IsoDateTimeSchema.nullable(),
  archived: z.boolean(),
  /**
   * the current engine's figures for an approved or installed link whose latest revision an older
   * engine computed (null otherwise; optional: added in 0.2.0). The list flags
   * `belowRequiredMargin`.
   */
  currentEngine: CurrentEngineSchema.nullable().optional(),
  createdAt: IsoDateTimeSchema,
  updatedAt: IsoDateTimeSchema,
});
export type LinkSummary = z.infer<typeof LinkSummarySchema>;

export const LinkListResponseSchema = pageOf(LinkSummarySchema);
export type LinkListResponse = z.infer<typeof LinkListResponseSchema>;

/**
 * One variant of a revision as stored: its design (defaults applied), the budget link-core computed
 * for it when the revision was saved, and that engine's version, read like the revision's own.
 */
export const RevisionVariantSchema = z.object({
  /** 0-based position in the revision's list (the `N` of `variants.N…` and of the promotion route) */
  index: z.number().int().min(0),
  name: z.string(),
  design: LinkDesignSchema,
  budget: LinkBudgetSchema,
  /** link-core version that computed `budget` */
  linkCoreVersion: z.string(),
  /** the current engine's margin when `linkCoreVersion` is older; null otherwise */
  currentEngine: CurrentEngineSchema.nullable(),
});
export type RevisionVariant = z.infer<typeof RevisionVariantSchema>;

/** One immutable revision: the design as stored (defaults applied) and the budget computed at save time. */
export const RevisionSchema = z.object({
  linkId: z.uuid(),
  revision: z.number().int().min(1),
  design: LinkDesignSchema,
  budget: LinkBudgetSchema,
  /** link-core version that computed `budget` */
  linkCoreVersion: z.string(),
  /** the current engine's margin when `linkCoreVersion` is older (optional: added in 0.2.0) */
  currentEngine: CurrentEngineSchema.nullable().optional(),
  note: z.string(),
  author: UserRefSchema,
  createdAt: IsoDateTimeSchema,
  /** who approved this revision and when; null while not approved */
  approval: ApprovalSchema.nullable(),
  /** the revision's variants in their order, each with its stored budget (optional: added with variants; the api always sends it) */
  variants: z.array(RevisionVariantSchema).optional(),
});
export type Revision = z.infer<typeof RevisionSchema>;

/** `GET /api/links/:id` and the answer to every save: the link with its latest revision in full. */
export const LinkDetailSchema = LinkSummarySchema.extend({
  design: LinkDesignSchema,
  budget: LinkBudgetSchema,
  linkCoreVersion: z.string(),
  /** the current engine's margin when the latest revision's engine is older */
  currentEngine: CurrentEngineSchema.nullable().optional(),
  note: z.string(),
  author: UserRefSchema,
  /** when the latest revision was saved */
  revisedAt: IsoDateTimeSchema,
  /** approval of the latest revision while the link is approved or installed; null otherwise */
  approval: ApprovalSchema.nullable(),
  /** whether any revision was ever approved (a link that never was may be deleted by its owner) */
  wasApproved: z.boolean(),
  /** the latest revision's variants (optional: added with variants; the api always sends it) */
  variants: z.array(RevisionVariantSchema).optional(),
});
export type LinkDetail = z.infer<typeof LinkDetailSchema>;

export const RevisionSummarySchema = RevisionSchema.omit({ design: true, budget: true, variants: true }).extend({
  linkMarginDb: z.number(),
  receivedPowerDbm: z.number(),
  rangeM: z.number(),
  wavelengthM: z.number(),
  /** how many variants the revision carries (optional: added with variants; the api always sends it) */
  variantCount: z.number().int().min(0).optional(),
});
export type RevisionSummary = z.infer<typeof RevisionSummarySchema>;

export const RevisionListResponseSchema = z.object({ items: z.array(RevisionSummarySchema) });
export type RevisionListResponse = z.infer<typeof RevisionListResponseSchema>;

/** The 409 answer to a save on a stale base: what the caller needs to show what changed. */
export const RevisionConflictBodySchema = ErrorBodySchema.extend({
  statusCode: z.literal(409),
  latestRevision: z.number().int().min(1),
  latest: RevisionSchema,
});
export type RevisionConflictBody = z.infer<typeof RevisionConflictBodySchema>;

export const RevisionDiffQuerySchema = z.strictObject({
  from: queryInteger({ min: 1, max: 1_000_000, fallback: 1 }),
  to: queryInteger({ min: 1, max: 1_000_000, fallback: 1 }),
});
export type RevisionDiffQuery = z.input<typeof RevisionDiffQuerySchema>;

export const DesignChangeSchema = z.object({
  /** dotted path of the design field, e.g. `transmitter.powerDbm` */
  path: z.string(),
  /** value in revision `from`; null when the field is absent there */
  from: z.unknown(),
  /** value in revision `to`; null when the field is absent there */
  to: z.unknown(),
});
export type DesignChange = z.infer<typeof DesignChangeSchema>;

export const RevisionDiffResponseSchema = z.object({
  linkId: z.uuid(),
  from: z.number().int(),
  to: z.number().int(),
  /** design fields whose values differ, in path order */
  changes: z.array(DesignChangeSchema),
});
export type RevisionDiffResponse = z.infer<typeof RevisionDiffResponseSchema>;

/** `POST /api/evaluate`: a design in, the link-core budget out (nothing stored). */
export const EvaluateRequestSchema = z.strictObject({ design: LinkDesignSchema });
export type EvaluateRequest = z.input<typeof EvaluateRequestSchema>;

import type { EntityManager } from 'typeorm';
import { evaluateLink, LINK_CORE_VERSION, LinkDesignSchema, formatZodIssues, type LinkDesign } from '@beamwright/link-core';
import { isAllowed, REVIEW_TRANSITIONS, VariantsRequestSchema, type LinkStatus, type PermissionAction, type Role } from '@beamwright/link-core/contracts';
import { Link } from '../../links/link.entity.js';
import { LinkReview } from '../../links/link-review.entity.js';
import { LinkRevision } from '../../links/link-revision.entity.js';
import { LinkRevisionVariant } from '../../links/link-revision-variant.entity.js';
import { computeVariantBudgets } from '../../links/link-budget.js';
import { latestRevisionColumns } from '../../links/latest-revision-columns.js';
import type { LinkFixture } from './demo-fixtures.js';

const DAY_MS = 86_400_000;

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return value !== null && typeof value === 'object' && !Array.isArray(value);
}

/** `changes` merged into `base`, objects recursively, everything else replaced. */
export function mergeDesign(base: Record<string, unknown>, changes: Record<string, unknown>): Record<string, unknown> {
  const merged: Record<string, unknown> = { ...base };
  for (const [key, value] of Object.entries(changes)) {
    merged[key] = isPlainObject(value) && isPlainObject(merged[key]) ? mergeDesign(merged[key] as Record<string, unknown>, value) : value;
  }
  return merged;
}

/**
 * Replays one fixture link's history (revisions and reviews in order) into the database, with the
 * same rules the API enforces: every design validated by LinkDesignSchema, every budget from
 * evaluateLink, every step by a role the shared rule table allows, every review a legal transition
 * on the latest revision, no self-approval. A revision's variants (each in full or as changes merged
 * into the revision's design) pass VariantsRequestSchema and get their budgets as the API's do.
 */
export async function seedDemoLink(
  manager: EntityManager,
  context: { organisationId: string; userIds: Map<string, string>; userRoles: Map<string, Role>; siteIds: Map<string, string>; now: Date },
  fixture: LinkFixture,
): Promise<void> {
  const where = (step: number) => `demo link "${fixture.name}", history step ${step + 1}`;
  const userId = (email: string, step: number) => {
    const id = context.userIds.get(email.toLowerCase());
    if (!id) throw new Error(`${where(step)}: unknown user ${email}`);
    return id;
  };
  const checkRole = (email: string, action: PermissionAction, step: number) => {
    const role = context.userRoles.get(email.toLowerCase());
    if (!isAllowed(role, action)) throw new Error(`${where(step)}: ${email} (${role ?? 'no role'}) may not ${action}`);
  };
  const siteId = (key: string | null) => {
    if (key === null) return null;
    const id = context.siteIds.get(key);
    if (!id) throw new Error(`demo link "${fixture.name}": unknown site key ${key}`);
    return id;
  };

  let link: Link | undefined;
  let design: LinkDesign | undefined;
  let latestAuthorId = '';
  let status: LinkStatus = 'draft';
  let firstAt: Date | undefined;
  let lastAt = context.now;

  for (const [step, event] of fixture.history.entries()) {
    const at = new Date(context.now.getTime() - event.daysAgo * DAY_MS);
    firstAt ??= at;
    lastAt = at;
    if (event.type === 'revision') {
      checkRole(event.author, link ? 'link.revise' : 'link.create', step);
      const raw = event.design ?? (design && event.changes ? mergeDesign(design as unknown as Record<string, unknown>, event.changes) : undefined);
      if (!raw) throw new Error(`${where(step)}: a revision needs "design" (first) or "changes" (later)`);
      const parsed = LinkDesignSchema.safeParse(raw);
      if (!parsed.success) {
        throw new Error(`${where(step)}: invalid design: ${formatZodIssues(parsed.error).map((issue) => `${issue.path} ${issue.message}`).join('; ')}`);
      }
      design = parsed.data;
      const revisionDesign = design;
      const rawVariants = (event.variants ?? []).map((variant) => ({
        name: variant.name,
        design: variant.design ?? mergeDesign(revisionDesign as unknown as Record<string, unknown>, variant.changes ?? {}),
      }));
      const parsedVariants = VariantsRequestSchema.safeParse(rawVariants);
      if (!parsedVariants.success) {
        throw new Error(`${where(step)}: invalid variants: ${formatZodIssues(parsedVariants.error).map((issue) => `${issue.path ? `variants.${issue.path}` : 'variants'} ${issue.message}`).join('; ')}`);
      }
      const variants = computeVariantBudgets(parsedVariants.data);
      const budget = evaluateLink(design);
      const latest = latestRevisionColumns(design, budget);
      if (!link) {
        link = await manager.save(
          manager.create(Link, {
            organisationId: context.organisationId,
            name: fixture.name,
            status: 'draft',
            ownerId: userId(fixture.owner, step),
            siteAId: siteId(fixture.siteA),
            siteBId: siteId(fixture.siteB),
            latestRevision: 1,
            ...latest,
          }),
        );
      } else {
        link.latestRevision += 1;
        Object.assign(link, latest);
        await manager.update(Link, { id: link.id }, { latestRevision: link.latestRevision, ...latest });
      }
      latestAuthorId = userId(event.author, step);
      const inserted = await manager.insert(LinkRevision, {
        linkId: link.id,
        revisionNumber: link.latestRevision,
        design,
        budget,
        linkCoreVersion: LINK_CORE_VERSION,
        note: event.note,
        authorId: latestAuthorId,
        createdAt: at,
      });
      const revisionId = (inserted.identifiers[0] as { id: string }).id;
      if (variants.length > 0) await manager.insert(LinkRevisionVariant, variants.map((variant) => ({ ...variant, revisionId })));
      status = 'draft';
    } else {
      if (!link) throw new Error(`${where(step)}: a review needs a revision before it`);
      const transition = REVIEW_TRANSITIONS[event.action];
      if (status !== transition.from) throw new Error(`${where(step)}: cannot ${event.action} a link that is ${status}`);
      checkRole(event.actor, transition.permission, step);
      const actorId = userId(event.actor, step);
      if (event.action === 'approve' && actorId === latestAuthorId) throw new Error(`${where(step)}: the author cannot approve their own revision`);
      await manager.insert(LinkReview, {
        linkId: link.id,
        revisionNumber: link.latestRevision,
        action: event.action,
        fromStatus: transition.from,
        toStatus: transition.to,
        comment: event.comment,
        actorId,
        createdAt: at,
      });
      status = transition.to;
    }
  }
  if (!link) throw new Error(`demo link "${fixture.name}" has no revision`);
  // dates of the story, not of the seed run
  await manager.query('UPDATE link SET status = $2, created_at = $3, updated_at = $4 WHERE id = $1', [link.id, status, firstAt, lastAt]);
}

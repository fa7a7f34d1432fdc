import { BadRequestException, ConflictException, ForbiddenException, Injectable, NotFoundException, UnprocessableEntityException, type OnModuleInit } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { Brackets, DataSource, In, Repository, type EntityManager } from 'typeorm';
import type {
  Approval,
  CreateLinkRequestSchema,
  CreateRevisionRequestSchema,
  LinkDetail,
  LinkListQuerySchema,
  LinkListResponse,
  PromoteVariantRequestSchema,
  Revision,
  RevisionDiffResponse,
  RevisionListResponse,
  UpdateLinkRequestSchema,
} from '@beamwright/link-core/contracts';
import { formatZodIssues, LinkDesignSchema, readStoredDesign, type LinkDesign } from '@beamwright/link-core';
import {
  diffDesigns,
  formerPrimaryVariantName,
  isDeletableLink,
  linkChangeOutcome,
  uniqueVariantName,
  variantNameKey,
  type LinkStatus,
  type TrailAction,
} from '@beamwright/link-core/contracts';
import type { z } from 'zod';
import type { AuthUser } from '../common/auth-user.js';
import { postgresErrorCode, UNIQUE_VIOLATION } from '../common/database-errors.js';
import type { Site } from '../sites/site.entity.js';
import { SitesService, type SiteGeometryChange } from '../sites/sites.service.js';
import { computeBudget, computeVariantBudgets, type VariantRow } from './link-budget.js';
import { latestRevisionColumns } from './latest-revision-columns.js';
import { approvalFrom, toLinkDetail, toLinkSummary, toRevision, toRevisionSummary } from './link.mapper.js';
import { LinkReview } from './link-review.entity.js';
import { LinkRevision } from './link-revision.entity.js';
import { LinkRevisionVariant } from './link-revision-variant.entity.js';
import { Link } from './link.entity.js';

type CreateLinkInput = z.output<typeof CreateLinkRequestSchema>;
type CreateRevisionInput = z.output<typeof CreateRevisionRequestSchema>;
type UpdateLinkInput = z.output<typeof UpdateLinkRequestSchema>;
type PromoteVariantInput = z.output<typeof PromoteVariantRequestSchema>;

/** What a save writes: revision base+1 with its design, note and variants (budgets computed). */
interface NextRevision {
  baseRevision: number;
  design: LinkDesign;
  note: string;
  variants: VariantRow[];
}
type LinkListQuery = z.output<typeof LinkListQuerySchema>;

const SORT_COLUMNS: Record<LinkListQuery['sort'], string> = {
  name: 'link.name',
  status: 'link.status',
  updatedAt: 'link.updatedAt',
  createdAt: 'link.createdAt',
  linkMarginDb: 'link.latestLinkMarginDb',
  rangeM: 'link.latestRangeM',
  wavelengthM: 'link.latestWavelengthM',
};

/** Thrown inside the save transaction when the conditional UPDATE matched no row. */
class StaleBaseRevision extends Error {}

function escapeLike(text: string): string {
  return text.replace(/[\\%_]/g, (character) => `\\${character}`);
}

/** "Depot ↔ Harbour Office", with a dash for a missing end. */
function endsText(siteA: { name: string } | null | undefined, siteB: { name: string } | null | undefined): string {
  return `${siteA?.name ?? '—'} ↔ ${siteB?.name ?? '—'}`;
}

const GEOMETRY_WORDS: Record<SiteGeometryChange['field'], { label: string; unit: string }> = {
  latitudeDeg: { label: 'latitude', unit: '°' },
  longitudeDeg: { label: 'longitude', unit: '°' },
  groundElevationM: { label: 'ground elevation', unit: ' m' },
  mountHeightM: { label: 'mount height', unit: ' m' },
};

@Injectable()
export class LinksService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @InjectRepository(Link) private readonly links: Repository<Link>,
    @InjectRepository(LinkRevision) private readonly revisions: Repository<LinkRevision>,
    @InjectRepository(LinkRevisionVariant) private readonly variants: Repository<LinkRevisionVariant>,
    @InjectRepository(LinkReview) private readonly reviews: Repository<LinkReview>,
    private readonly sites: SitesService,
  ) {}

  onModuleInit(): void {
    // the sites module cannot import this one (it is imported by it): it calls us back instead
    this.sites.onGeometryChange((manager, site, changes, caller) => this.markPathChanged(manager, site, changes, caller.userId));
  }

  async list(caller: AuthUser, query: LinkListQuery): Promise<LinkListResponse> {
    const builder = this.links
      .createQueryBuilder('link')
      .leftJoinAndSelect('link.owner', 'owner')
      .leftJoinAndSelect('link.siteA', 'siteA')
      .leftJoinAndSelect('link.siteB', 'siteB')
      .where('link.organisationId = :organisationId', { organisationId: caller.organisationId });
    if (query.archived === 'only') builder.andWhere('link.archivedAt IS NOT NULL');
    else if (query.archived !== 'include') builder.andWhere('link.archivedAt IS NULL');
    if (query.status) builder.andWhere('link.status = :status', { status: query.status });
    if (query.siteId) builder.andWhere('(link.siteAId = :siteId OR link.siteBId = :siteId)', { siteId: query.siteId });
    if (query.q) {
      const pattern = `%${escapeLike(query.q)}%`;
      builder.andWhere(
        new Brackets((text) => {
          text.where('link.name ILIKE :pattern', { pattern }).orWhere('siteA.name ILIKE :pattern').orWhere('siteB.name ILIKE :pattern');
        }),
      );
    }
    const direction = query.order === 'asc' ? 'ASC' : 'DESC';
    // the id as a tie-breaker keeps pages stable when sort values repeat
    builder.orderBy(SORT_COLUMNS[query.sort], direction).addOrderBy('link.id', 'ASC');
    builder.skip((query.page - 1) * query.pageSize).take(query.pageSize);
    const [rows, total] = await builder.getManyAndCount();
    const latest = await this.findSignedOffLatestRevisions(rows);
    return { items: rows.map((link) => toLinkSummary(link, latest.get(link.id))), page: query.page, pageSize: query.pageSize, total };
  }

  /**
   * The latest revision of each approved or installed link of a page, in one query: the list puts
   * the current engine's margin beside those an older engine computed.
   */
  private async findSignedOffLatestRevisions(rows: Link[]): Promise<Map<string, LinkRevision>> {
    const signedOff = rows.filter((link) => link.status === 'approved' || link.status === 'installed');
    if (signedOff.length === 0) return new Map();
    const revisions = await this.revisions.find({
      select: { linkId: true, revisionNumber: true, design: true, budget: true, linkCoreVersion: true },
      where: signedOff.map((link) => ({ linkId: link.id, revisionNumber: link.latestRevision })),
    });
    return new Map(revisions.map((revision) => [revision.linkId, revision]));
  }

  async get(caller: AuthUser, id: string): Promise<LinkDetail> {
    const link = await this.findOwnedLink(caller, id);
    const [latest, approval, wasApproved, variants] = await Promise.all([
      this.findRevision(link.id, link.latestRevision),
      this.findApproval(link.id, link.latestRevision),
      this.reviews.exists({ where: { linkId: link.id, action: 'approve' } }),
      this.findVariants(link.id, link.latestRevision),
    ]);
    return toLinkDetail(link, latest, approval, wasApproved, variants);
  }

  async create(caller: AuthUser, input: CreateLinkInput): Promise<LinkDetail> {
    await this.checkSites(caller, input.siteAId ?? null, input.siteBId ?? null);
    const { budget, linkCoreVersion } = computeBudget(input.design);
    const variants = computeVariantBudgets(input.variants);
    const linkId = await this.dataSource.transaction(async (manager) => {
      const link = await manager.save(
        manager.create(Link, {
          organisationId: caller.organisationId,
          name: input.name,
          status: 'draft',
          ownerId: caller.userId,
          siteAId: input.siteAId ?? null,
          siteBId: input.siteBId ?? null,
          latestRevision: 1,
          ...latestRevisionColumns(input.design, budget),
        }),
      );
      await this.insertRevision(
        manager,
        { linkId: link.id, revisionNumber: 1, design: input.design, budget, linkCoreVersion, note: input.note, authorId: caller.userId },
        variants,
      );
      return link.id;
    });
    return this.get(caller, linkId);
  }

  /**
   * Renames a link or changes its ends. What an approval covered does not change silently
   * (linkChangeOutcome in the shared rules): in review or approved, the change sends the link back
   * to draft; installed, a rename is recorded and a change of sites refused. The link row is
   * locked so the status read is the status changed.
   */
  async update(caller: AuthUser, id: string, changes: UpdateLinkInput): Promise<LinkDetail> {
    const found = await this.findOwnedLink(caller, id);
    this.refuseIfArchived(found, 'changed');
    const siteAId = changes.siteAId === undefined ? found.siteAId : changes.siteAId;
    const siteBId = changes.siteBId === undefined ? found.siteBId : changes.siteBId;
    await this.checkSites(caller, siteAId, siteBId);
    await this.dataSource.transaction(async (manager) => {
      const link = await manager.findOne(Link, { where: { id: found.id, organisationId: caller.organisationId }, lock: { mode: 'pessimistic_write' } });
      if (!link) throw new NotFoundException('Link not found');
      this.refuseIfArchived(link, 'changed');
      const name = changes.name ?? link.name;
      const renamed = name !== link.name;
      const sitesChanged = siteAId !== link.siteAId || siteBId !== link.siteBId;
      const outcome = linkChangeOutcome(link.status, { renamed, sitesChanged });
      if (outcome === 'refused') {
        throw new ConflictException(
          'The link is installed: its terminals are mounted on the roofs of its sites, so its sites cannot change. Archive this link and create a new one for the new path.',
        );
      }
      const status: LinkStatus = outcome === 'back_to_draft' ? 'draft' : link.status;
      await manager.update(Link, { id: link.id }, { name, siteAId, siteBId, status });
      if (outcome === 'silent') return;
      const since = link.status === 'in_review' ? `while revision ${link.latestRevision} was in review` : `since the approval of revision ${link.latestRevision}`;
      const entries: { action: TrailAction; comment: string }[] = [];
      if (sitesChanged) {
        const ids = [link.siteAId, link.siteBId, siteAId, siteBId].filter((value): value is string => !!value);
        const named = await this.sites.findOwnedByIds(caller, ids);
        const byId = (siteId: string | null) => named.find((site) => site.id === siteId) ?? null;
        entries.push({
          action: 'path_changed',
          comment: `Sites changed from ${endsText(byId(link.siteAId), byId(link.siteBId))} to ${endsText(byId(siteAId), byId(siteBId))} ${since}`,
        });
      }
      if (renamed) entries.push({ action: 'renamed', comment: `Renamed from "${link.name}" to "${name}" ${since}` });
      for (const entry of entries) {
        await this.recordTrail(manager, link, entry.action, link.status, status, entry.comment, caller.userId);
      }
    });
    return this.get(caller, found.id);
  }

  /** Archives a link (kept readable, hidden from the default list, read-only) or restores it. */
  async setArchived(caller: AuthUser, id: string, archived: boolean): Promise<LinkDetail> {
    await this.dataSource.transaction(async (manager) => {
      const link = await manager.findOne(Link, { where: { id, organisationId: caller.organisationId }, lock: { mode: 'pessimistic_write' } });
      if (!link) throw new NotFoundException('Link not found');
      if ((link.archivedAt !== null) === archived) throw new ConflictException(archived ? 'The link is already archived' : 'The link is not archived');
      await manager.update(Link, { id: link.id }, { archivedAt: archived ? new Date() : null });
      await this.recordTrail(manager, link, archived ? 'archived' : 'restored', link.status, link.status, archived ? 'Archived' : 'Restored from the archive', caller.userId);
    });
    return this.get(caller, id);
  }

  /**
   * Deletes a draft that was never approved, by its owner, with its revisions and trail in one
   * transaction. Anything else is part of the record: 409, archive it instead.
   */
  async remove(caller: AuthUser, id: string): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const link = await manager.findOne(Link, { where: { id, organisationId: caller.organisationId }, lock: { mode: 'pessimistic_write' } });
      if (!link) throw new NotFoundException('Link not found');
      if (link.ownerId !== caller.userId) throw new ForbiddenException('Only the owner of a link can delete it');
      const wasApproved = await manager.exists(LinkReview, { where: { linkId: link.id, action: 'approve' } });
      if (!isDeletableLink({ status: link.status, wasApproved })) {
        throw new ConflictException(
          wasApproved
            ? 'The link was approved once and is part of the review record, so it cannot be deleted; archive it instead (POST /api/links/:id/archive)'
            : 'Only a draft can be deleted; this link is in review or further along. Archive it instead (POST /api/links/:id/archive)',
        );
      }
      await manager.delete(LinkReview, { linkId: link.id });
      await manager.delete(LinkRevision, { linkId: link.id });
      await manager.delete(Link, { id: link.id });
    });
  }

  /** 409 for a change to an archived link: restore it first. */
  refuseIfArchived(link: Link, verb: string): void {
    if (link.archivedAt !== null) throw new ConflictException(`The link is archived and cannot be ${verb}; restore it first`);
  }

  /** One trail entry on the link's latest revision (inside the caller's transaction). */
  async recordTrail(manager: EntityManager, link: Link, action: TrailAction, fromStatus: LinkStatus, toStatus: LinkStatus, comment: string, actorId: string): Promise<void> {
    await manager.insert(LinkReview, { linkId: link.id, revisionNumber: link.latestRevision, action, fromStatus, toStatus, comment, actorId });
  }

  /**
   * A site's position or heights changed: every approved or installed link that uses it is marked
   * changed since approval, with a trail entry saying what moved. Runs in the site update's
   * transaction. The actor is the member who edited the site.
   */
  private async markPathChanged(manager: EntityManager, site: Site, changes: SiteGeometryChange[], actorId: string): Promise<void> {
    const links = await manager.find(Link, {
      where: [
        { siteAId: site.id, status: In(['approved', 'installed']) },
        { siteBId: site.id, status: In(['approved', 'installed']) },
      ],
      lock: { mode: 'pessimistic_write' },
    });
    if (links.length === 0) return;
    const what = changes.map(({ field, from, to }) => `${GEOMETRY_WORDS[field].label} ${from}${GEOMETRY_WORDS[field].unit} → ${to}${GEOMETRY_WORDS[field].unit}`).join(', ');
    const now = new Date();
    for (const link of links) {
      await manager.update(Link, { id: link.id }, { pathChangedAt: now });
      await this.recordTrail(manager, link, 'path_changed', link.status, link.status, `Site ${site.name}: ${what} since the approval of revision ${link.latestRevision}`, actorId);
    }
  }

  /** Saves revision base+1 with the body's design, note and variants (see saveRevision). */
  async createRevision(caller: AuthUser, id: string, input: CreateRevisionInput): Promise<LinkDetail> {
    this.refuseIfArchived(await this.findOwnedLink(caller, id), 'revised');
    return this.saveRevision(caller, id, { baseRevision: input.baseRevision, design: input.design, note: input.note, variants: computeVariantBudgets(input.variants) });
  }

  /**
   * Promotes variant `index` of revision `revisionNumber`: saves revision n+1 whose design is the
   * variant's, carrying the other designs as its variants; the former design takes the promoted
   * variant's place in the list, under `primaryName` or "Primary of revision n". Revision n is the
   * base, so it must be the latest (409 otherwise, as for any save); the link goes back to draft.
   * Stored designs are read as the engine that stored them meant them (readStoredDesign) and their
   * budgets computed afresh by the current engine, as for any new revision.
   */
  async promoteVariant(caller: AuthUser, id: string, revisionNumber: number, index: number, input: PromoteVariantInput): Promise<LinkDetail> {
    const link = await this.findOwnedLink(caller, id);
    this.refuseIfArchived(link, 'revised');
    const [revision, variants] = await Promise.all([this.findRevision(link.id, revisionNumber), this.findVariants(link.id, revisionNumber)]);
    const promoted = variants.find((variant) => variant.position === index);
    if (!promoted) {
      throw new NotFoundException(
        `Revision ${revisionNumber} has no variant ${index}: ${variants.length === 0 ? 'it has none' : `its variants are numbered 0 to ${variants.length - 1}`}`,
      );
    }
    if (revisionNumber !== link.latestRevision) throw await this.staleBaseConflict(caller, link.id, revisionNumber);
    const others = variants.filter((variant) => variant !== promoted);
    if (input.primaryName !== undefined) {
      const clash = others.find((variant) => variantNameKey(variant.name) === variantNameKey(input.primaryName!));
      if (clash) {
        const message = `must differ from the name of variant ${clash.position} ("${clash.name}"); names are compared regardless of case`;
        throw new BadRequestException({ message: `primaryName ${message}`, issues: [{ path: 'primaryName', message }] });
      }
    }
    const primaryName = input.primaryName ?? uniqueVariantName(formerPrimaryVariantName(revisionNumber), others.map((variant) => variant.name));
    const design = this.promotableDesign(revisionNumber, `variants.${index}.design`, readStoredDesign(promoted.design, promoted.linkCoreVersion));
    const formerPrimary = this.promotableDesign(revisionNumber, 'design', readStoredDesign(revision.design, revision.linkCoreVersion));
    const nextVariants = variants.map((variant) =>
      variant === promoted
        ? { name: primaryName, design: formerPrimary }
        : { name: variant.name, design: this.promotableDesign(revisionNumber, `variants.${variant.position}.design`, readStoredDesign(variant.design, variant.linkCoreVersion)) },
    );
    const note =
      input.note ?? `Promoted the variant "${promoted.name}" of revision ${revisionNumber}; the design of revision ${revisionNumber} is kept as the variant "${primaryName}".`;
    return this.saveRevision(caller, link.id, { baseRevision: revisionNumber, design, note, variants: computeVariantBudgets(nextVariants) });
  }

  /**
   * A stored design checked against today's LinkDesignSchema before it is saved again: one a later
   * schema refuses is a 422 naming the stored field (`variants.2.design.rangeM` of revision n), so a
   * promotion never writes a design a plain save would refuse.
   */
  private promotableDesign(revisionNumber: number, path: string, stored: LinkDesign): LinkDesign {
    const result = LinkDesignSchema.safeParse(stored);
    if (result.success) return result.data;
    const issues = formatZodIssues(result.error).map((issue) => ({ path: issue.path ? `${path}.${issue.path}` : path, message: issue.message }));
    throw new UnprocessableEntityException({
      message: `The stored ${path} of revision ${revisionNumber} no longer passes the design checks (${issues[0]!.path} ${issues[0]!.message}); nothing was saved. Correct it and save a revision instead.`,
      issues,
    });
  }

  /**
   * Saves revision base+1. The link row's `latest_revision` is advanced by a conditional UPDATE
   * (… WHERE latest_revision = base) inside the transaction that inserts the revision and its
   * variants: PostgreSQL locks the row, so of concurrent saves on one base exactly one matches; the
   * others see the advanced counter once the winner commits, match nothing and get a 409. The
   * unique (link_id, revision_number) constraint backs this up. Every budget is computed before the
   * transaction opens, so a refused one (422) writes nothing.
   */
  private async saveRevision(caller: AuthUser, id: string, next: NextRevision): Promise<LinkDetail> {
    const { budget, linkCoreVersion } = computeBudget(next.design);
    try {
      await this.dataSource.transaction(async (manager) => {
        const result = await manager
          .createQueryBuilder()
          .update(Link)
          .set({
            latestRevision: () => 'latest_revision + 1',
            status: 'draft',
            ...latestRevisionColumns(next.design, budget),
          })
          .where('id = :id AND organisation_id = :organisationId AND latest_revision = :base', {
            id,
            organisationId: caller.organisationId,
            base: next.baseRevision,
          })
          .returning('latest_revision')
          .execute();
        const rows = result.raw as { latest_revision: number }[];
        if (rows.length !== 1) throw new StaleBaseRevision();
        await this.insertRevision(
          manager,
          { linkId: id, revisionNumber: rows[0]!.latest_revision, design: next.design, budget, linkCoreVersion, note: next.note, authorId: caller.userId },
          next.variants,
        );
      });
    } catch (error) {
      if (error instanceof StaleBaseRevision || postgresErrorCode(error) === UNIQUE_VIOLATION) {
        throw await this.staleBaseConflict(caller, id, next.baseRevision);
      }
      throw error;
    }
    return this.get(caller, id);
  }

  /** Inserts a revision and its variants, inside the caller's transaction. */
  private async insertRevision(
    manager: EntityManager,
    revision: Pick<LinkRevision, 'linkId' | 'revisionNumber' | 'design' | 'budget' | 'linkCoreVersion' | 'note' | 'authorId'>,
    variants: readonly VariantRow[],
  ): Promise<void> {
    const inserted = await manager.insert(LinkRevision, revision);
    const revisionId = (inserted.identifiers[0] as { id: string }).id;
    if (variants.length > 0) await manager.insert(LinkRevisionVariant, variants.map((variant) => ({ ...variant, revisionId })));
  }

  async listRevisions(caller: AuthUser, id: string): Promise<RevisionListResponse> {
    const link = await this.findOwnedLink(caller, id);
    const [rows, approvals, variantCounts] = await Promise.all([
      this.revisions.find({ where: { linkId: link.id }, relations: { author: true }, order: { revisionNumber: 'ASC' } }),
      this.reviews.find({ where: { linkId: link.id, action: 'approve' }, relations: { actor: true } }),
      this.countVariants(link.id),
    ]);
    const approvalByRevision = new Map(approvals.map((review) => [review.revisionNumber, approvalFrom(review)]));
    return { items: rows.map((row) => toRevisionSummary(row, approvalByRevision.get(row.revisionNumber) ?? null, variantCounts.get(row.id) ?? 0)) };
  }

  async getRevision(caller: AuthUser, id: string, revisionNumber: number): Promise<Revision> {
    const link = await this.findOwnedLink(caller, id);
    const [revision, approval, variants] = await Promise.all([
      this.findRevision(link.id, revisionNumber),
      this.findApproval(link.id, revisionNumber),
      this.findVariants(link.id, revisionNumber),
    ]);
    return toRevision(revision, approval, variants);
  }

  async diff(caller: AuthUser, id: string, from: number, to: number): Promise<RevisionDiffResponse> {
    const link = await this.findOwnedLink(caller, id);
    const [before, after] = await Promise.all([this.findRevision(link.id, from), this.findRevision(link.id, to)]);
    return { linkId: link.id, from, to, changes: diffDesigns(before.design, after.design) };
  }

  /** The link if it belongs to the caller's organisation; 404 otherwise (ids of others do not leak). */
  async findOwnedLink(caller: AuthUser, id: string): Promise<Link> {
    const link = await this.links.findOne({
      where: { id, organisationId: caller.organisationId },
      relations: { owner: true, siteA: true, siteB: true },
    });
    if (!link) throw new NotFoundException('Link not found');
    return link;
  }

  async findRevision(linkId: string, revisionNumber: number): Promise<LinkRevision> {
    const revision = await this.revisions.findOne({ where: { linkId, revisionNumber }, relations: { author: true } });
    if (!revision) throw new NotFoundException(`Revision ${revisionNumber} not found`);
    return revision;
  }

  /** The variants of a revision in their order (none for a revision without, or one that does not exist). */
  async findVariants(linkId: string, revisionNumber: number): Promise<LinkRevisionVariant[]> {
    return this.variants.find({ where: { revision: { linkId, revisionNumber } }, order: { position: 'ASC' } });
  }

  /** How many variants each revision of a link carries, by revision id (revisions without are absent). */
  private async countVariants(linkId: string): Promise<Map<string, number>> {
    const rows = await this.variants
      .createQueryBuilder('variant')
      .innerJoin('variant.revision', 'revision')
      .select('variant.revisionId', 'revisionId')
      .addSelect('COUNT(*)::int', 'count')
      .where('revision.linkId = :linkId', { linkId })
      .groupBy('variant.revisionId')
      .getRawMany<{ revisionId: string; count: number }>();
    return new Map(rows.map((row) => [row.revisionId, row.count]));
  }

  async findApproval(linkId: string, revisionNumber: number): Promise<Approval | null> {
    const review = await this.reviews.findOne({
      where: { linkId, revisionNumber, action: 'approve' },
      relations: { actor: true },
      order: { createdAt: 'DESC' },
    });
    return approvalFrom(review);
  }

  private async staleBaseConflict(caller: AuthUser, id: string, baseRevision: number): Promise<ConflictException | NotFoundException> {
    const link = await this.links.findOne({ where: { id, organisationId: caller.organisationId } });
    if (!link) return new NotFoundException('Link not found');
    const [latest, approval, variants] = await Promise.all([
      this.findRevision(link.id, link.latestRevision),
      this.findApproval(link.id, link.latestRevision),
      this.findVariants(link.id, link.latestRevision),
    ]);
    return new ConflictException({
      message: `Revision ${baseRevision} is not the latest: revision ${link.latestRevision} was saved in the meantime. Reload, re-apply your changes and save again.`,
      latestRevision: link.latestRevision,
      latest: toRevision(latest, approval, variants),
    });
  }

  private async checkSites(caller: AuthUser, siteAId: string | null, siteBId: string | null): Promise<void> {
    const issues: { path: string; message: string }[] = [];
    if (siteAId && siteBId && siteAId === siteBId) issues.push({ path: 'siteBId', message: 'must be a different site from siteAId' });
    const found = new Set((await this.sites.findOwnedByIds(caller, [siteAId, siteBId].filter((value): value is string => !!value))).map((site) => site.id));
    if (siteAId && !found.has(siteAId)) issues.push({ path: 'siteAId', message: 'is not a site of your organisation' });
    if (siteBId && !found.has(siteBId)) issues.push({ path: 'siteBId', message: 'is not a site of your organisation' });
    if (issues.length > 0) throw new BadRequestException({ message: `${issues[0]!.path} ${issues[0]!.message}`, issues });
  }
}

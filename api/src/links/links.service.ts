import { BadRequestException, ConflictException, ForbiddenException, Injectable, NotFoundException, type OnModuleInit } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { Brackets, DataSource, In, Repository, type EntityManager } from 'typeorm';
import type {
  Approval,
  CreateLinkRequestSchema,
  CreateRevisionRequestSchema,
  LinkDetail,
  LinkListQuerySchema,
  LinkListResponse,
  Revision,
  RevisionDiffResponse,
  RevisionListResponse,
  UpdateLinkRequestSchema,
} from '@beamwright/link-core/contracts';
import { diffDesigns, isDeletableLink, linkChangeOutcome, type LinkStatus, type TrailAction } from '@beamwright/link-core/contracts';
import type { z } from 'zod';
import type { AuthUser } from '../common/auth-user.js';
import { postgresErrorCode, UNIQUE_VIOLATION } from '../common/database-errors.js';
import type { Site } from '../sites/site.entity.js';
import { SitesService, type SiteGeometryChange } from '../sites/sites.service.js';
import { computeBudget } from './link-budget.js';
import { latestRevisionColumns } from './latest-revision-columns.js';
import { approvalFrom, toLinkDetail, toLinkSummary, toRevision, toRevisionSummary } from './link.mapper.js';
import { LinkReview } from './link-review.entity.js';
import { LinkRevision } from './link-revision.entity.js';
import { Link } from './link.entity.js';

type CreateLinkInput = z.output<typeof CreateLinkRequestSchema>;
type CreateRevisionInput = z.output<typeof CreateRevisionRequestSchema>;
type UpdateLinkInput = z.output<typeof UpdateLinkRequestSchema>;
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
    const [latest, approval, wasApproved] = await Promise.all([
      this.findRevision(link.id, link.latestRevision),
      this.findApproval(link.id, link.latestRevision),
      this.reviews.exists({ where: { linkId: link.id, action: 'approve' } }),
    ]);
    return toLinkDetail(link, latest, approval, wasApproved);
  }

  async create(caller: AuthUser, input: CreateLinkInput): Promise<LinkDetail> {
    await this.checkSites(caller, input.siteAId ?? null, input.siteBId ?? null);
    const { budget, linkCoreVersion } = computeBudget(input.design);
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
      await manager.insert(LinkRevision, {
        linkId: link.id,
        revisionNumber: 1,
        design: input.design,
        budget,
        linkCoreVersion,
        note: input.note,
        authorId: caller.userId,
      });
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

  /**
   * Saves revision base+1. The link row's `latest_revision` is advanced by a conditional UPDATE
   * (… WHERE latest_revision = base) inside the transaction that inserts the revision: PostgreSQL
   * locks the row, so of concurrent saves on one base exactly one matches; the others see the
   * advanced counter once the winner commits, match nothing and get a 409. The unique
   * (link_id, revision_number) constraint backs this up.
   */
  async createRevision(caller: AuthUser, id: string, input: CreateRevisionInput): Promise<LinkDetail> {
    this.refuseIfArchived(await this.findOwnedLink(caller, id), 'revised');
    const { budget, linkCoreVersion } = computeBudget(input.design);
    try {
      await this.dataSource.transaction(async (manager) => {
        const result = await manager
          .createQueryBuilder()
          .update(Link)
          .set({
            latestRevision: () => 'latest_revision + 1',
            status: 'draft',
            ...latestRevisionColumns(input.design, budget),
          })
          .where('id = :id AND organisation_id = :organisationId AND latest_revision = :base', {
            id,
            organisationId: caller.organisationId,
            base: input.baseRevision,
          })
          .returning('latest_revision')
          .execute();
        const rows = result.raw as { latest_revision: number }[];
        if (rows.length !== 1) throw new StaleBaseRevision();
        await manager.insert(LinkRevision, {
          linkId: id,
          revisionNumber: rows[0]!.latest_revision,
          design: input.design,
          budget,
          linkCoreVersion,
          note: input.note,
          authorId: caller.userId,
        });
      });
    } catch (error) {
      if (error instanceof StaleBaseRevision || postgresErrorCode(error) === UNIQUE_VIOLATION) {
        throw await this.staleBaseConflict(caller, id, input.baseRevision);
      }
      throw error;
    }
    return this.get(caller, id);
  }

  async listRevisions(caller: AuthUser, id: string): Promise<RevisionListResponse> {
    const link = await this.findOwnedLink(caller, id);
    const [rows, approvals] = await Promise.all([
      this.revisions.find({ where: { linkId: link.id }, relations: { author: true }, order: { revisionNumber: 'ASC' } }),
      this.reviews.find({ where: { linkId: link.id, action: 'approve' }, relations: { actor: true } }),
    ]);
    const approvalByRevision = new Map(approvals.map((review) => [review.revisionNumber, approvalFrom(review)]));
    return { items: rows.map((row) => toRevisionSummary(row, approvalByRevision.get(row.revisionNumber) ?? null)) };
  }

  async getRevision(caller: AuthUser, id: string, revisionNumber: number): Promise<Revision> {
    const link = await this.findOwnedLink(caller, id);
    const revision = await this.findRevision(link.id, revisionNumber);
    return toRevision(revision, await this.findApproval(link.id, revisionNumber));
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
    const latest = await this.findRevision(link.id, link.latestRevision);
    return new ConflictException({
      message: `Revision ${baseRevision} is not the latest: revision ${link.latestRevision} was saved in the meantime. Reload, re-apply your changes and save again.`,
      latestRevision: link.latestRevision,
      latest: toRevision(latest, await this.findApproval(link.id, link.latestRevision)),
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

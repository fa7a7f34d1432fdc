import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { Brackets, DataSource, Repository } from 'typeorm';
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
import { diffDesigns } from '@beamwright/link-core/contracts';
import type { z } from 'zod';
import type { AuthUser } from '../common/auth-user.js';
import { postgresErrorCode, UNIQUE_VIOLATION } from '../common/database-errors.js';
import { SitesService } from '../sites/sites.service.js';
import { computeBudget } from './link-budget.js';
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

@Injectable()
export class LinksService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @InjectRepository(Link) private readonly links: Repository<Link>,
    @InjectRepository(LinkRevision) private readonly revisions: Repository<LinkRevision>,
    @InjectRepository(LinkReview) private readonly reviews: Repository<LinkReview>,
    private readonly sites: SitesService,
  ) {}

  async list(caller: AuthUser, query: LinkListQuery): Promise<LinkListResponse> {
    const builder = this.links
      .createQueryBuilder('link')
      .leftJoinAndSelect('link.owner', 'owner')
      .leftJoinAndSelect('link.siteA', 'siteA')
      .leftJoinAndSelect('link.siteB', 'siteB')
      .where('link.organisationId = :organisationId', { organisationId: caller.organisationId });
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
    return { items: rows.map(toLinkSummary), page: query.page, pageSize: query.pageSize, total };
  }

  async get(caller: AuthUser, id: string): Promise<LinkDetail> {
    const link = await this.findOwnedLink(caller, id);
    const latest = await this.findRevision(link.id, link.latestRevision);
    return toLinkDetail(link, latest, await this.findApproval(link.id, link.latestRevision));
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
          latestLinkMarginDb: budget.linkMarginDb,
          latestReceivedPowerDbm: budget.receivedPowerDbm,
          latestRangeM: input.design.rangeM,
          latestWavelengthM: input.design.transmitter.wavelengthM,
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

  async update(caller: AuthUser, id: string, changes: UpdateLinkInput): Promise<LinkDetail> {
    const link = await this.findOwnedLink(caller, id);
    const siteAId = changes.siteAId === undefined ? link.siteAId : changes.siteAId;
    const siteBId = changes.siteBId === undefined ? link.siteBId : changes.siteBId;
    await this.checkSites(caller, siteAId, siteBId);
    await this.links.update(
      { id: link.id, organisationId: caller.organisationId },
      { name: changes.name ?? link.name, siteAId, siteBId },
    );
    return this.get(caller, link.id);
  }

  /**
   * Saves revision base+1. The link row's `latest_revision` is advanced by a conditional UPDATE
   * (… WHERE latest_revision = base) inside the transaction that inserts the revision: PostgreSQL
   * locks the row, so of concurrent saves on one base exactly one matches; the others see the
   * advanced counter once the winner commits, match nothing and get a 409. The unique
   * (link_id, revision_number) constraint backs this up.
   */
  async createRevision(caller: AuthUser, id: string, input: CreateRevisionInput): Promise<LinkDetail> {
    const { budget, linkCoreVersion } = computeBudget(input.design);
    try {
      await this.dataSource.transaction(async (manager) => {
        const result = await manager
          .createQueryBuilder()
          .update(Link)
          .set({
            latestRevision: () => 'latest_revision + 1',
            status: 'draft',
            latestLinkMarginDb: budget.linkMarginDb,
            latestReceivedPowerDbm: budget.receivedPowerDbm,
            latestRangeM: input.design.rangeM,
            latestWavelengthM: input.design.transmitter.wavelengthM,
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

import { ConflictException, ForbiddenException, Injectable } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, Repository } from 'typeorm';
import { LINK_STATUS_PHRASES, REVIEW_TRANSITIONS, reviewActionRefusal, rolesFor, type ReviewAction, type ReviewActionResponse, type ReviewListResponse } from '@beamwright/link-core/contracts';
import type { AuthUser } from '../common/auth-user.js';
import { toReviewEntry } from './link.mapper.js';
import { LinkReview } from './link-review.entity.js';
import { Link } from './link.entity.js';
import { LinksService } from './links.service.js';

@Injectable()
export class ReviewsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @InjectRepository(LinkReview) private readonly reviews: Repository<LinkReview>,
    private readonly links: LinksService,
  ) {}

  async list(caller: AuthUser, linkId: string): Promise<ReviewListResponse> {
    const link = await this.links.findOwnedLink(caller, linkId);
    const rows = await this.reviews.find({ where: { linkId: link.id }, relations: { actor: true }, order: { createdAt: 'ASC', id: 'ASC' } });
    return { items: rows.map(toReviewEntry) };
  }

  /**
   * Moves the link's latest revision through review. The status change is a conditional UPDATE on
   * (latest revision, expected status), so a revision saved or acted on concurrently makes this a
   * 409 rather than a review of the wrong revision; the trail entry is written in the same transaction.
   * Who may act comes from the shared rule table (reviewActionRefusal): the role (403, also checked
   * by the route's guard), the author's own revision (403), the status (409).
   */
  async act(caller: AuthUser, linkId: string, revisionNumber: number, action: ReviewAction, comment: string): Promise<ReviewActionResponse> {
    const link = await this.links.findOwnedLink(caller, linkId);
    const revision = await this.links.findRevision(link.id, revisionNumber);
    const transition = REVIEW_TRANSITIONS[action];
    if (revisionNumber !== link.latestRevision) {
      throw new ConflictException(`Revision ${revisionNumber} is not the latest (${link.latestRevision}); only the latest revision can be ${transition.verb}`);
    }
    this.links.refuseIfArchived(link, transition.verb);
    const refusal = reviewActionRefusal(caller.role, link.status, revision.authorId === caller.userId, action);
    if (refusal === 'role') throw new ForbiddenException(`This action needs one of the roles: ${rolesFor(transition.permission).join(', ')}`);
    if (refusal === 'author') throw new ForbiddenException('You cannot approve your own revision; another reviewer must approve it');
    // a status refusal is left to the conditional UPDATE below, which also catches a concurrent change
    const reviewId = await this.dataSource.transaction(async (manager) => {
      const result = await manager
        .createQueryBuilder()
        .update(Link)
        // an approval covers the path as it is now: it clears "changed since approval"
        .set(action === 'approve' ? { status: transition.to, pathChangedAt: null } : { status: transition.to })
        .where('id = :id AND organisation_id = :organisationId AND latest_revision = :revisionNumber AND status = :from', {
          id: link.id,
          organisationId: caller.organisationId,
          revisionNumber,
          from: transition.from,
        })
        .returning('status')
        .execute();
      if ((result.raw as unknown[]).length !== 1) {
        const current = await manager.findOneOrFail(Link, { where: { id: link.id } });
        throw new ConflictException(
          current.latestRevision !== revisionNumber
            ? `Revision ${revisionNumber} is no longer the latest (${current.latestRevision})`
            : `The link is ${LINK_STATUS_PHRASES[current.status]}; only a link that is ${LINK_STATUS_PHRASES[transition.from]} can be ${transition.verb}`,
        );
      }
      const inserted = await manager.insert(LinkReview, {
        linkId: link.id,
        revisionNumber,
        action,
        fromStatus: transition.from,
        toStatus: transition.to,
        comment,
        actorId: caller.userId,
      });
      return (inserted.identifiers[0] as { id: string }).id;
    });
    const review = await this.reviews.findOneOrFail({ where: { id: reviewId }, relations: { actor: true } });
    return { status: transition.to, review: toReviewEntry(review) };
  }
}

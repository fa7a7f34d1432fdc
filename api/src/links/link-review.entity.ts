import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { LINK_STATUSES, TRAIL_ACTIONS, type LinkStatus, type TrailAction } from '@beamwright/link-core/contracts';
import { User } from '../users/user.entity.js';
import { Link } from './link.entity.js';

/**
 * One step of the review trail (append-only): who did what to which revision, and when. Besides the
 * review actions it records the changes an approval did not cover (rename, path change) and archiving.
 */
@Entity({ name: 'link_review' })
@Index(['linkId', 'createdAt'])
export class LinkReview {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'link_id', type: 'uuid' })
  linkId: string;

  @ManyToOne(() => Link, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'link_id' })
  link?: Link;

  @Column({ name: 'revision_number', type: 'integer' })
  revisionNumber: number;

  @Column({ type: 'enum', enum: TRAIL_ACTIONS, enumName: 'review_action' })
  action: TrailAction;

  // own enum type: TypeORM's generator cannot share one type between tables
  @Column({ name: 'from_status', type: 'enum', enum: LINK_STATUSES, enumName: 'link_review_status' })
  fromStatus: LinkStatus;

  @Column({ name: 'to_status', type: 'enum', enum: LINK_STATUSES, enumName: 'link_review_status' })
  toStatus: LinkStatus;

  @Column({ type: 'text', default: '' })
  comment: string;

  @Column({ name: 'actor_id', type: 'uuid' })
  actorId: string;

  @ManyToOne(() => User)
  @JoinColumn({ name: 'actor_id' })
  actor?: User;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}

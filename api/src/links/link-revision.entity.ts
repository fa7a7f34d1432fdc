import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique } from 'typeorm';
import type { LinkBudget, LinkDesign } from '@beamwright/link-core';
import { User } from '../users/user.entity.js';
import { Link } from './link.entity.js';

/**
 * One saved state of a link's design. Rows are only ever inserted: the unique (link, number)
 * constraint is the last line of defence against two saves producing the same revision.
 */
@Entity({ name: 'link_revision' })
@Unique('UQ_link_revision_link_number', ['linkId', 'revisionNumber'])
export class LinkRevision {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'link_id', type: 'uuid' })
  linkId: string;

  @ManyToOne(() => Link, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'link_id' })
  link?: Link;

  @Column({ name: 'revision_number', type: 'integer' })
  revisionNumber: number;

  /** the design as validated by LinkDesignSchema, defaults applied */
  @Column({ type: 'jsonb' })
  design: LinkDesign;

  /** evaluateLink(design) at save time */
  @Column({ type: 'jsonb' })
  budget: LinkBudget;

  @Column({ name: 'link_core_version', type: 'varchar', length: 40 })
  linkCoreVersion: string;

  @Column({ type: 'text', default: '' })
  note: string;

  @Column({ name: 'author_id', type: 'uuid' })
  authorId: string;

  @ManyToOne(() => User)
  @JoinColumn({ name: 'author_id' })
  author?: User;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}

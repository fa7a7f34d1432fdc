import { Check, Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { LinkBudget, LinkDesign } from '@beamwright/link-core';
import { MAX_VARIANTS_PER_REVISION } from '@beamwright/link-core/contracts';
import { LinkRevision } from './link-revision.entity.js';

/**
 * A named alternative of a revision's design, saved in the revision's transaction and, like the
 * revision, only ever inserted. Each row keeps its own budget and the engine version that computed
 * it, so it is read the way its revision is (versioned read, current engine beside an older one).
 * Its key is (revision, position): the position is the 0-based index of the revision body's
 * `variants` list. Names are unique within a revision regardless of case; the contract checks that
 * before anything is written (VariantsRequestSchema); the position check backs up its limit of 8.
 */
@Entity({ name: 'link_revision_variant' })
@Check('CHK_link_revision_variant_position', `"position" >= 0 AND "position" < ${MAX_VARIANTS_PER_REVISION}`)
export class LinkRevisionVariant {
  @PrimaryColumn({ name: 'revision_id', type: 'uuid' })
  revisionId: string;

  @ManyToOne(() => LinkRevision, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'revision_id' })
  revision?: LinkRevision;

  /** 0-based index in the revision's list */
  @PrimaryColumn({ type: 'smallint' })
  position: number;

  @Column({ type: 'varchar', length: 100 })
  name: string;

  /** the design as validated by LinkDesignSchema, defaults applied */
  @Column({ type: 'jsonb' })
  design: LinkDesign;

  /** evaluateLink(design) when the revision was saved */
  @Column({ type: 'jsonb' })
  budget: LinkBudget;

  @Column({ name: 'link_core_version', type: 'varchar', length: 40 })
  linkCoreVersion: string;
}

import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { LINK_STATUSES, type LinkStatus } from '@beamwright/link-core/contracts';
import { Organisation } from '../organisations/organisation.entity.js';
import { Site } from '../sites/site.entity.js';
import { User } from '../users/user.entity.js';

/**
 * A link between two terminals. Its design lives in immutable revisions; `latestRevision` is the
 * optimistic-concurrency counter that a save advances with a conditional UPDATE, and the
 * `latest*` columns copy figures of that revision so the links table can sort and filter in SQL.
 */
@Entity({ name: 'link' })
@Index(['organisationId', 'updatedAt'])
export class Link {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'organisation_id', type: 'uuid' })
  organisationId: string;

  @ManyToOne(() => Organisation, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organisation_id' })
  organisation?: Organisation;

  @Column({ type: 'varchar', length: 200 })
  name: string;

  @Column({ type: 'enum', enum: LINK_STATUSES, enumName: 'link_status', default: 'draft' })
  status: LinkStatus;

  @Index()
  @Column({ name: 'owner_id', type: 'uuid' })
  ownerId: string;

  @ManyToOne(() => User)
  @JoinColumn({ name: 'owner_id' })
  owner?: User;

  @Index()
  @Column({ name: 'site_a_id', type: 'uuid', nullable: true })
  siteAId: string | null;

  @ManyToOne(() => Site, { nullable: true })
  @JoinColumn({ name: 'site_a_id' })
  siteA?: Site | null;

  @Index()
  @Column({ name: 'site_b_id', type: 'uuid', nullable: true })
  siteBId: string | null;

  @ManyToOne(() => Site, { nullable: true })
  @JoinColumn({ name: 'site_b_id' })
  siteB?: Site | null;

  @Column({ name: 'latest_revision', type: 'integer' })
  latestRevision: number;

  @Column({ name: 'latest_link_margin_db', type: 'double precision' })
  latestLinkMarginDb: number;

  @Column({ name: 'latest_received_power_dbm', type: 'double precision' })
  latestReceivedPowerDbm: number;

  @Column({ name: 'latest_range_m', type: 'double precision' })
  latestRangeM: number;

  @Column({ name: 'latest_wavelength_m', type: 'double precision' })
  latestWavelengthM: number;

  /**
   * Set when a site under this approved or installed link moved or changed height after the
   * approval; cleared by the next approval. The approval no longer covers the path while it is set.
   */
  @Column({ name: 'path_changed_at', type: 'timestamptz', nullable: true })
  pathChangedAt: Date | null;

  /** Set while the link is archived: readable, hidden from the default list, takes no changes. */
  @Column({ name: 'archived_at', type: 'timestamptz', nullable: true })
  archivedAt: Date | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}

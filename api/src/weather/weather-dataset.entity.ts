import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { VISIBILITY_DEFINITIONS, type VisibilityDefinition } from '@beamwright/link-core';
import { VISIBILITY_UNITS, type VisibilityUnit, type WeatherColumnMapping } from '@beamwright/link-core/contracts';
import { Organisation } from '../organisations/organisation.entity.js';
import { Site } from '../sites/site.entity.js';
import { User } from '../users/user.entity.js';

/**
 * A site's weather history: hourly (or any-interval) visibility records and what else was measured.
 * Written once, in the transaction of its import; its records never change afterwards.
 */
@Entity({ name: 'weather_dataset' })
export class WeatherDataset {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index()
  @Column({ name: 'organisation_id', type: 'uuid' })
  organisationId: string;

  @ManyToOne(() => Organisation, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organisation_id' })
  organisation?: Organisation;

  /** the site the records describe; a data set may also stand for a whole area (null) */
  @Index()
  @Column({ name: 'site_id', type: 'uuid', nullable: true })
  siteId: string | null;

  @ManyToOne(() => Site, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'site_id' })
  site?: Site | null;

  @Column({ type: 'varchar', length: 200 })
  name: string;

  @Column({ type: 'text', default: '' })
  notes: string;

  /** definition of the stored visibility figures (stored in metres) */
  @Column({ name: 'visibility_definition', type: 'enum', enum: VISIBILITY_DEFINITIONS, enumName: 'visibility_definition' })
  visibilityDefinition: VisibilityDefinition;

  /** the unit the file gave the visibility in; null for generated data */
  @Column({ name: 'source_unit', type: 'enum', enum: VISIBILITY_UNITS, enumName: 'visibility_unit', nullable: true })
  sourceUnit: VisibilityUnit | null;

  @Column({ name: 'source_file_name', type: 'varchar', length: 255, nullable: true })
  sourceFileName: string | null;

  /** the column mapping the import used (null for generated data) */
  @Column({ type: 'jsonb', nullable: true })
  mapping: WeatherColumnMapping | null;

  @Column({ name: 'record_count', type: 'integer' })
  recordCount: number;

  @Column({ name: 'missing_visibility_count', type: 'integer', default: 0 })
  missingVisibilityCount: number;

  @Column({ name: 'first_observed_at', type: 'timestamptz', nullable: true })
  firstObservedAt: Date | null;

  @Column({ name: 'last_observed_at', type: 'timestamptz', nullable: true })
  lastObservedAt: Date | null;

  @Column({ name: 'has_rain_rate', type: 'boolean', default: false })
  hasRainRate: boolean;

  @Column({ name: 'has_snow_rate', type: 'boolean', default: false })
  hasSnowRate: boolean;

  @Column({ name: 'has_temperature', type: 'boolean', default: false })
  hasTemperature: boolean;

  @Column({ name: 'has_cn2', type: 'boolean', default: false })
  hasCn2: boolean;

  /** the demo's synthetic records: invented, never measured */
  @Column({ type: 'boolean', default: false })
  invented: boolean;

  @Column({ name: 'created_by_id', type: 'uuid', nullable: true })
  createdById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by_id' })
  createdBy?: User | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}

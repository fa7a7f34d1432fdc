import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { ROW_ERROR_POLICIES, type RowErrorPolicy, type WeatherColumnMapping, type WeatherImportJob, type WeatherImportResult } from '@beamwright/link-core/contracts';
import { Organisation } from '../organisations/organisation.entity.js';
import { User } from '../users/user.entity.js';
import { WeatherDataset } from './weather-dataset.entity.js';

/** The life of an import: the file arrives (uploading), waits for a worker, runs, and ends. */
export const WEATHER_IMPORT_ROW_STATES = ['uploading', 'queued', 'running', 'succeeded', 'failed', 'cancelled'] as const;
export type WeatherImportRowState = (typeof WEATHER_IMPORT_ROW_STATES)[number];

/**
 * One upload and its import job. The uploaded bytes sit in weather_import_chunk until the import
 * ends, so any API process can run the job and a restart loses nothing; the progress columns are
 * written by the worker outside the import's own transaction, so the browser can follow it.
 */
@Entity({ name: 'weather_import' })
export class WeatherImport {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index()
  @Column({ name: 'organisation_id', type: 'uuid' })
  organisationId: string;

  @ManyToOne(() => Organisation, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organisation_id' })
  organisation?: Organisation;

  @Column({ name: 'created_by_id', type: 'uuid', nullable: true })
  createdById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by_id' })
  createdBy?: User | null;

  @Column({ type: 'enum', enum: WEATHER_IMPORT_ROW_STATES, enumName: 'weather_import_state', default: 'uploading' })
  state: WeatherImportRowState;

  /** the data set to be: its name, site, notes and mapping (set once the upload's fields are read) */
  @Column({ type: 'varchar', length: 200, default: '' })
  name: string;

  @Column({ name: 'site_id', type: 'uuid', nullable: true })
  siteId: string | null;

  @Column({ type: 'text', default: '' })
  notes: string;

  @Column({ type: 'jsonb', nullable: true })
  mapping: WeatherColumnMapping | null;

  @Column({ name: 'on_row_errors', type: 'enum', enum: ROW_ERROR_POLICIES, enumName: 'weather_row_error_policy', default: 'reject' })
  onRowErrors: RowErrorPolicy;

  @Column({ name: 'file_name', type: 'varchar', length: 255, default: '' })
  fileName: string;

  /** bytes of the file as uploaded (compressed, for gzip) */
  @Column({ name: 'byte_count', type: 'bigint', default: 0, transformer: { to: (value: number) => value, from: (value: string | number) => Number(value) } })
  byteCount: number;

  @Column({ type: 'boolean', default: false })
  gzip: boolean;

  /** text encoding found in the first bytes: utf8, or latin1 when they are not valid UTF-8 */
  @Column({ type: 'varchar', length: 16, default: 'utf8' })
  encoding: 'utf8' | 'latin1';

  /** the field delimiter found in the header line */
  @Column({ type: 'varchar', length: 1, default: ',' })
  delimiter: string;

  /** the header row as found in the first bytes */
  @Column({ type: 'jsonb', nullable: true })
  header: string[] | null;

  /** the pg-boss job that runs the import */
  @Column({ name: 'job_id', type: 'uuid', nullable: true })
  jobId: string | null;

  /** runs started (a retry after an interrupted run counts up); a run only commits while it is the latest */
  @Column({ type: 'integer', default: 0 })
  attempt: number;

  @Column({ name: 'bytes_read', type: 'bigint', default: 0, transformer: { to: (value: number) => value, from: (value: string | number) => Number(value) } })
  bytesRead: number;

  @Column({ name: 'rows_read', type: 'integer', default: 0 })
  rowsRead: number;

  /** set by the running worker every few seconds; a run whose heartbeat stops is failed and retried */
  @Column({ name: 'heartbeat_at', type: 'timestamptz', nullable: true })
  heartbeatAt: Date | null;

  @Column({ name: 'cancel_requested', type: 'boolean', default: false })
  cancelRequested: boolean;

  @Column({ type: 'jsonb', nullable: true })
  result: WeatherImportResult | null;

  @Column({ type: 'jsonb', nullable: true })
  error: WeatherImportJob['error'];

  @Column({ name: 'dataset_id', type: 'uuid', nullable: true })
  datasetId: string | null;

  @ManyToOne(() => WeatherDataset, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'dataset_id' })
  dataset?: WeatherDataset | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}

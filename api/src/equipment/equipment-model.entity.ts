import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { EQUIPMENT_KINDS, type EquipmentKind, type ReceiverSpec, type TransmitterSpec } from '@beamwright/link-core/contracts';
import { Organisation } from '../organisations/organisation.entity.js';

/**
 * A transmitter or receiver model of the organisation's catalogue. The datasheet figures live in
 * `spec` (validated by the contract's zod schema of its kind before every write), because the two
 * kinds share no figures and the UI reads the spec as one object.
 */
@Entity({ name: 'equipment_model' })
@Index(['organisationId', 'kind'])
export class EquipmentModel {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'organisation_id', type: 'uuid' })
  organisationId: string;

  @ManyToOne(() => Organisation, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organisation_id' })
  organisation?: Organisation;

  @Column({ type: 'enum', enum: EQUIPMENT_KINDS, enumName: 'equipment_kind' })
  kind: EquipmentKind;

  @Column({ type: 'varchar', length: 200 })
  name: string;

  @Column({ type: 'varchar', length: 200, default: '' })
  maker: string;

  @Column({ type: 'text', default: '' })
  notes: string;

  /** invented demo models whose figures are typical values, not a datasheet */
  @Column({ type: 'boolean', default: false })
  illustrative: boolean;

  @Column({ type: 'jsonb' })
  spec: TransmitterSpec | ReceiverSpec;

  /** set when the model is retired: hidden from the pickers, still readable by id */
  @Column({ name: 'retired_at', type: 'timestamptz', nullable: true })
  retiredAt: Date | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}

import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { Organisation } from '../organisations/organisation.entity.js';

/** A rooftop or mast that carries a terminal. Coordinates are WGS 84. */
@Entity({ name: 'site' })
export class Site {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index()
  @Column({ name: 'organisation_id', type: 'uuid' })
  organisationId: string;

  @ManyToOne(() => Organisation, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organisation_id' })
  organisation?: Organisation;

  @Column({ type: 'varchar', length: 200 })
  name: string;

  @Column({ name: 'latitude_deg', type: 'double precision' })
  latitudeDeg: number;

  @Column({ name: 'longitude_deg', type: 'double precision' })
  longitudeDeg: number;

  @Column({ name: 'ground_elevation_m', type: 'double precision' })
  groundElevationM: number;

  @Column({ name: 'mount_height_m', type: 'double precision' })
  mountHeightM: number;

  @Column({ type: 'text', default: '' })
  notes: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}

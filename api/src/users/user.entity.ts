import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { ROLES, type Role } from '@beamwright/link-core/contracts';
import { Organisation } from '../organisations/organisation.entity.js';

@Entity({ name: 'app_user' })
export class User {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index()
  @Column({ name: 'organisation_id', type: 'uuid' })
  organisationId: string;

  @ManyToOne(() => Organisation, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'organisation_id' })
  organisation?: Organisation;

  /** stored lower-cased so sign-in is case-insensitive */
  @Column({ type: 'varchar', length: 320, unique: true })
  email: string;

  @Column({ name: 'display_name', type: 'varchar', length: 200 })
  displayName: string;

  /** argon2id hash in PHC string form (salt and parameters included) */
  @Column({ name: 'password_hash', type: 'varchar', length: 255 })
  passwordHash: string;

  @Column({ type: 'enum', enum: ROLES, enumName: 'user_role' })
  role: Role;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  /** set while the member is deactivated: no sign-in, and their tokens are refused */
  @Column({ name: 'deactivated_at', type: 'timestamptz', nullable: true })
  deactivatedAt: Date | null;
}

import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from '../users/user.entity.js';

/**
 * One sign-in: the access token carries this row's id as its `sid` claim, and every request
 * checks that the row still exists, has not ended and has not been revoked. Deleting the user
 * deletes their sessions.
 */
@Entity({ name: 'user_session' })
export class UserSession {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index()
  @Column({ name: 'user_id', type: 'uuid' })
  userId: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user?: User;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  /** when the access token of this session expires */
  @Column({ name: 'expires_at', type: 'timestamptz' })
  expiresAt: Date;

  /** set by sign-out, or when a change to the user ends their sessions */
  @Column({ name: 'revoked_at', type: 'timestamptz', nullable: true })
  revokedAt: Date | null;
}

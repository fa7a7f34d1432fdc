import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { Repository } from 'typeorm';
import type { AuthUser } from '../common/auth-user.js';
import { UserSession } from './user-session.entity.js';

/** Ended sessions are kept this long (for a member list's "last signed in", say), then deleted. */
const ENDED_SESSION_RETENTION_DAYS = 30;

/**
 * Sessions behind the access tokens. Any change that must end a member's access (a sign-out, a
 * deactivation, a password change, a role change if wanted) revokes sessions here; the next
 * request with such a token is a 401.
 */
@Injectable()
export class SessionsService {
  constructor(@InjectRepository(UserSession) private readonly sessions: Repository<UserSession>) {}

  /** Starts a session at sign-in, ending with the token; prunes the user's long-ended ones. */
  async start(userId: string, expiresAt: Date): Promise<UserSession> {
    await this.sessions
      .createQueryBuilder()
      .delete()
      .where('user_id = :userId', { userId })
      .andWhere(`coalesce(revoked_at, expires_at) < now() - make_interval(days => :days)`, { days: ENDED_SESSION_RETENTION_DAYS })
      .execute();
    return this.sessions.save(this.sessions.create({ userId, expiresAt, revokedAt: null }));
  }

  /**
   * The caller behind a token, read in one query: the session must be live and belong to the
   * user, and the user must exist and be active. The role and organisation come from the
   * database, never from the token. Null means the token no longer grants anything.
   */
  async findCaller(sessionId: string, userId: string): Promise<AuthUser | null> {
    const session = await this.sessions
      .createQueryBuilder('session')
      .innerJoinAndSelect('session.user', 'member')
      .where('session.id = :sessionId AND session.userId = :userId', { sessionId, userId })
      .andWhere('session.revokedAt IS NULL AND session.expiresAt > now()')
      .andWhere('member.deactivatedAt IS NULL')
      .getOne();
    if (!session?.user) return null;
    return { userId: session.user.id, organisationId: session.user.organisationId, role: session.user.role, sessionId: session.id };
  }

  /** Ends one session (sign-out). True when it was live. */
  async revoke(sessionId: string): Promise<boolean> {
    const result = await this.sessions
      .createQueryBuilder()
      .update()
      .set({ revokedAt: () => 'now()' })
      .where('id = :sessionId AND revoked_at IS NULL', { sessionId })
      .execute();
    return (result.affected ?? 0) > 0;
  }

  /**
   * Ends every live session of a user, except `exceptSessionId` when given (a password change
   * keeps the session it was made from). Returns how many were ended.
   */
  async revokeAllForUser(userId: string, options: { exceptSessionId?: string } = {}): Promise<number> {
    const query = this.sessions
      .createQueryBuilder()
      .update()
      .set({ revokedAt: () => 'now()' })
      .where('user_id = :userId AND revoked_at IS NULL AND expires_at > now()', { userId });
    if (options.exceptSessionId) query.andWhere('id <> :exceptSessionId', { exceptSessionId: options.exceptSessionId });
    const result = await query.execute();
    return result.affected ?? 0;
  }
}

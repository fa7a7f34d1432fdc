import { Column, Entity, Index, PrimaryColumn } from 'typeorm';

/**
 * One fixed-window counter of @nestjs/throttler, shared by every API process through PostgreSQL.
 * Written only by PostgresThrottlerStorage in single atomic statements; rows whose window and
 * block have both ended are swept.
 */
@Entity({ name: 'rate_limit_counter' })
@Index('IDX_rate_limit_counter_expiry', ['windowEndsAt'])
export class RateLimitCounter {
  /** HMAC of the throttler name and the tracked value (an address or an e-mail): never stored in clear */
  @PrimaryColumn({ type: 'varchar', length: 128 })
  key: string;

  /** the named throttler (e.g. sign-in-account), for reading the table */
  @Column({ type: 'varchar', length: 64 })
  throttler: string;

  /** attempts counted in the current window (a refused attempt while blocked is not counted) */
  @Column({ type: 'integer' })
  hits: number;

  @Column({ name: 'window_ends_at', type: 'timestamptz' })
  windowEndsAt: Date;

  /** set when the count went over the limit: every attempt is refused until then */
  @Column({ name: 'blocked_until', type: 'timestamptz', nullable: true })
  blockedUntil: Date | null;
}

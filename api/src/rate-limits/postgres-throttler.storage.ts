import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { ThrottlerStorage } from '@nestjs/throttler';
import { DataSource } from 'typeorm';
import { RateLimitCounter } from './rate-limit-counter.entity.js';

type ThrottlerStorageRecord = Awaited<ReturnType<ThrottlerStorage['increment']>>;

/** How often one process deletes the counters that have ended (a scheduling hint, not shared state). */
const SWEEP_INTERVAL_MS = 60_000;

interface CounterRow {
  hits: number;
  expires_in_ms: string | number;
  blocked_for_ms: string | number | null;
}

/**
 * @nestjs/throttler's storage in PostgreSQL, so every API process on one database counts the same
 * attempts. A fixed window per key: the first hit opens a window of `ttl`; going over `limit`
 * blocks the key for `blockDuration`; once the window or the block has ended the next hit starts
 * afresh. Each hit is one `INSERT … ON CONFLICT … DO UPDATE … RETURNING`, which PostgreSQL runs
 * atomically per row, so concurrent attempts cannot both see the last free slot. Times come from
 * the database clock, so processes with skewed clocks still agree: clock_timestamp(), not now(),
 * because a hit that waited for the row lock must not judge the row by the time it started.
 */
@Injectable()
export class PostgresThrottlerStorage implements ThrottlerStorage {
  private lastSweepAtMs = 0;

  constructor(@InjectDataSource() private readonly dataSource: DataSource) {}

  async increment(key: string, ttl: number, limit: number, blockDuration: number, throttlerName: string): Promise<ThrottlerStorageRecord> {
    await this.sweepNowAndThen();
    // $3 ttl, $4 limit and $5 blockDuration in milliseconds. In DO UPDATE, `counter` is the row
    // before this hit; `restart` (window or block over) and `blocked` are spelt out in each SET.
    const rows: CounterRow[] = await this.dataSource.query(
      `INSERT INTO rate_limit_counter AS counter (key, throttler, hits, window_ends_at, blocked_until)
       VALUES ($1, $2, 1, clock_timestamp() + make_interval(secs => $3::float8 / 1000),
               CASE WHEN 1 > $4::int THEN clock_timestamp() + make_interval(secs => $5::float8 / 1000) END)
       ON CONFLICT (key) DO UPDATE SET
         hits = CASE
           WHEN counter.blocked_until > clock_timestamp() THEN counter.hits
           WHEN counter.window_ends_at <= clock_timestamp() OR counter.blocked_until <= clock_timestamp() THEN 1
           ELSE counter.hits + 1 END,
         window_ends_at = CASE
           WHEN counter.blocked_until > clock_timestamp() THEN counter.window_ends_at
           WHEN counter.window_ends_at <= clock_timestamp() OR counter.blocked_until <= clock_timestamp() THEN EXCLUDED.window_ends_at
           ELSE counter.window_ends_at END,
         blocked_until = CASE
           WHEN counter.blocked_until > clock_timestamp() THEN counter.blocked_until
           WHEN (CASE WHEN counter.window_ends_at <= clock_timestamp() OR counter.blocked_until <= clock_timestamp() THEN 1 ELSE counter.hits + 1 END) > $4::int
             THEN clock_timestamp() + make_interval(secs => $5::float8 / 1000)
           ELSE NULL END
       RETURNING hits,
         extract(epoch FROM window_ends_at - clock_timestamp()) * 1000 AS expires_in_ms,
         extract(epoch FROM blocked_until - clock_timestamp()) * 1000 AS blocked_for_ms`,
      [key, throttlerName, ttl, limit, blockDuration],
    );
    const row = rows[0];
    const blockedForMs = row.blocked_for_ms === null ? 0 : Number(row.blocked_for_ms);
    const isBlocked = blockedForMs > 0;
    return {
      totalHits: row.hits,
      // seconds, rounded up, as the package's own in-memory storage reports them
      timeToExpire: Math.max(0, Math.ceil(Number(row.expires_in_ms) / 1000)),
      isBlocked,
      timeToBlockExpire: isBlocked ? Math.ceil(blockedForMs / 1000) : 0,
    };
  }

  /**
   * Gives back one counted hit of a key that is not blocked (a sign-in that succeeded, say), so
   * only the attempts that failed use up the limit.
   */
  async forgive(key: string): Promise<void> {
    await this.dataSource
      .createQueryBuilder()
      .update(RateLimitCounter)
      .set({ hits: () => 'greatest(hits - 1, 0)' })
      .where('key = :key AND window_ends_at > clock_timestamp() AND (blocked_until IS NULL OR blocked_until <= clock_timestamp())', { key })
      .execute();
  }

  /** Deletes the counters whose window and block have both ended. */
  async sweep(): Promise<number> {
    const result = await this.dataSource
      .createQueryBuilder()
      .delete()
      .from(RateLimitCounter)
      .where('window_ends_at <= clock_timestamp() AND (blocked_until IS NULL OR blocked_until <= clock_timestamp())')
      .execute();
    return result.affected ?? 0;
  }

  private async sweepNowAndThen(): Promise<void> {
    const nowMs = Date.now();
    if (nowMs - this.lastSweepAtMs < SWEEP_INTERVAL_MS) return;
    this.lastSweepAtMs = nowMs;
    await this.sweep();
  }
}

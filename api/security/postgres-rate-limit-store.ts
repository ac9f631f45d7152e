import { QueryTypes, type Sequelize } from 'sequelize';
import type { ClientRateLimitInfo, IncrementResponse, Options, Store } from 'express-rate-limit';

interface CounterRow {
  hits: number;
  reset_at: Date;
}

// Rows deleted per prune; a backlog larger than this goes with the next new windows.
const PRUNE_BATCH = 500;

/**
 * Deletes counters whose window has ended: they count nothing any more, and a row per
 * guessed address or e-mail would otherwise stay for ever. Run whenever a write opens a
 * new window (at most once per key and window, so the table stays about as large as the
 * live counters); SKIP LOCKED leaves rows another request is counting right now, so a
 * prune never waits on a sign-in. Returns how many rows went.
 */
export async function pruneExpiredRateLimits(sequelize: Sequelize): Promise<number> {
  const rows = await sequelize.query(
    `DELETE FROM rate_limits
      WHERE key IN (SELECT key FROM rate_limits WHERE reset_at <= now() LIMIT ${PRUNE_BATCH} FOR UPDATE SKIP LOCKED)
      RETURNING key`,
    { type: QueryTypes.SELECT },
  );
  return rows.length;
}

/**
 * An express-rate-limit store over the rate_limits table (migration 0008), so the
 * counters survive restarts and are shared by every API process on the database.
 * Each limiter gets its own store with its own prefix: the same client address is a
 * different counter for sign-in and for password reset.
 */
export class PostgresRateLimitStore implements Store {
  readonly localKeys = false;
  private windowMs = 60_000;

  constructor(
    private readonly sequelize: Sequelize,
    readonly prefix: string,
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  // One statement, so two processes counting the same key at once never lose a hit:
  // a live row adds one, a row past its window starts a new one.
  async increment(key: string): Promise<IncrementResponse> {
    const [row] = await this.sequelize.query<CounterRow>(
      `INSERT INTO rate_limits AS counter (key, hits, reset_at)
       VALUES (:key, 1, now() + make_interval(secs => :windowMs / 1000.0))
       ON CONFLICT (key) DO UPDATE SET
         hits = CASE WHEN counter.reset_at <= now() THEN 1 ELSE counter.hits + 1 END,
         reset_at = CASE WHEN counter.reset_at <= now() THEN EXCLUDED.reset_at ELSE counter.reset_at END
       RETURNING hits, reset_at`,
      { replacements: { key: this.prefix + key, windowMs: this.windowMs }, type: QueryTypes.SELECT },
    );
    if (row.hits === 1) await pruneExpiredRateLimits(this.sequelize);
    return { totalHits: row.hits, resetTime: new Date(row.reset_at) };
  }

  async decrement(key: string): Promise<void> {
    await this.sequelize.query(
      `UPDATE rate_limits SET hits = GREATEST(hits - 1, 0) WHERE key = :key AND reset_at > now()`,
      { replacements: { key: this.prefix + key } },
    );
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const [row] = await this.sequelize.query<CounterRow>(
      `SELECT hits, reset_at FROM rate_limits WHERE key = :key AND reset_at > now()`,
      { replacements: { key: this.prefix + key }, type: QueryTypes.SELECT },
    );
    return row ? { totalHits: row.hits, resetTime: new Date(row.reset_at) } : undefined;
  }

  async resetKey(key: string): Promise<void> {
    await this.sequelize.query(`DELETE FROM rate_limits WHERE key = :key`, {
      replacements: { key: this.prefix + key },
    });
  }
}

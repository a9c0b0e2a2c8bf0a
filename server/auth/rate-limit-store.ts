import type { ClientRateLimitInfo, IncrementResponse, Options, Store } from 'express-rate-limit';
import type { DataSource } from 'typeorm';

/**
 * express-rate-limit's counters in PostgreSQL (table rate_limit_hit), so every app instance counts
 * against the same limit. One upsert per hit; a window that has run out starts again at 1.
 */
export class PostgresRateLimitStore implements Store {
  localKeys = false;
  prefix: string;
  private windowMs = 60_000;

  constructor(private readonly dataSource: DataSource, prefix: string) {
    this.prefix = prefix;
  }

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const rows: Array<{ hits: number; reset_at: Date }> = await this.dataSource.query(
      'SELECT hits, reset_at FROM rate_limit_hit WHERE key = $1 AND reset_at > now()',
      [this.prefix + key],
    );
    const row = rows[0];
    return row ? { totalHits: row.hits, resetTime: new Date(row.reset_at) } : undefined;
  }

  async increment(key: string): Promise<IncrementResponse> {
    const rows: Array<{ hits: number; reset_at: Date }> = await this.dataSource.query(
      `INSERT INTO rate_limit_hit AS r (key, hits, reset_at) VALUES ($1, 1, now() + $2 * interval '1 millisecond')
       ON CONFLICT (key) DO UPDATE SET
         hits = CASE WHEN r.reset_at <= now() THEN 1 ELSE r.hits + 1 END,
         reset_at = CASE WHEN r.reset_at <= now() THEN EXCLUDED.reset_at ELSE r.reset_at END
       RETURNING hits, reset_at`,
      [this.prefix + key, this.windowMs],
    );
    const row = rows[0] as { hits: number; reset_at: Date };
    if (Math.random() < 0.01) void this.prune();
    return { totalHits: row.hits, resetTime: new Date(row.reset_at) };
  }

  async decrement(key: string): Promise<void> {
    await this.dataSource.query('UPDATE rate_limit_hit SET hits = greatest(hits - 1, 0) WHERE key = $1', [this.prefix + key]);
  }

  async resetKey(key: string): Promise<void> {
    await this.dataSource.query('DELETE FROM rate_limit_hit WHERE key = $1', [this.prefix + key]);
  }

  private async prune(): Promise<void> {
    await this.dataSource.query(`DELETE FROM rate_limit_hit WHERE reset_at < now() - interval '1 hour'`).catch(() => undefined);
  }
}

import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import { QueryTypes, type Sequelize } from 'sequelize';

/**
 * express-rate-limit counters kept in MariaDB, so that every server instance behind a load
 * balancer counts the same attempts.
 */
export class MariaDbRateLimitStore implements Store {
  private windowMs = 60_000;
  readonly prefix: string;

  constructor(
    private readonly sequelize: Sequelize,
    prefix = 'rl:',
  ) {
    this.prefix = prefix;
  }

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const rows = await this.sequelize.query<{ hits: number; reset_at: Date }>(
      'SELECT hits, reset_at FROM rate_limit_hits WHERE `key` = ? AND reset_at > ?',
      { replacements: [this.prefix + key, new Date()], type: QueryTypes.SELECT },
    );
    const row = rows[0];
    return row ? { totalHits: row.hits, resetTime: new Date(row.reset_at) } : undefined;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const now = new Date();
    const resetAt = new Date(now.getTime() + this.windowMs);
    await this.sequelize.query(
      'INSERT INTO rate_limit_hits (`key`, hits, reset_at) VALUES (?, 1, ?) ' +
        'ON DUPLICATE KEY UPDATE hits = IF(reset_at <= ?, 1, hits + 1), reset_at = IF(reset_at <= ?, VALUES(reset_at), reset_at)',
      { replacements: [this.prefix + key, resetAt, now, now], type: QueryTypes.INSERT },
    );
    return (await this.get(key)) ?? { totalHits: 1, resetTime: resetAt };
  }

  async decrement(key: string): Promise<void> {
    await this.sequelize.query('UPDATE rate_limit_hits SET hits = GREATEST(hits, 1) - 1 WHERE `key` = ?', {
      replacements: [this.prefix + key],
      type: QueryTypes.UPDATE,
    });
  }

  async resetKey(key: string): Promise<void> {
    await this.sequelize.query('DELETE FROM rate_limit_hits WHERE `key` = ?', { replacements: [this.prefix + key], type: QueryTypes.DELETE });
  }
}

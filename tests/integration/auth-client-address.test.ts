// Which client address a rate limit counts: the socket's, or the one our trusted proxies saw; never a value a client wrote.
import { describe, expect, it } from 'vitest';
import { clientKey, limitSpecs } from '@/server/http/rate-limit';
import { testDb } from '../support/db';

describe('clientKey', () => {
  it('uses the socket address when no proxy is trusted and no header is sent', () => {
    expect(clientKey('198.51.100.7', null, 0)).toBe('198.51.100.7');
  });

  it('puts every request carrying X-Forwarded-For into one bucket when no proxy is trusted', () => {
    // @astrojs/node reports the header's first value as the client address; rotating it must gain nothing.
    expect(clientKey('203.0.113.1', '203.0.113.1', 0)).toBe('forwarded-untrusted');
    expect(clientKey('203.0.113.2', '203.0.113.2, 198.51.100.9', 0)).toBe('forwarded-untrusted');
  });

  it('takes the address the nearest trusted proxy appended, not the first one', () => {
    expect(clientKey('203.0.113.50', '203.0.113.50, 198.51.100.20', 1)).toBe('198.51.100.20');
    expect(clientKey('203.0.113.50', '203.0.113.50, 198.51.100.20, 192.0.2.1', 2)).toBe('198.51.100.20');
  });

  it('falls back to the leftmost value when the header is shorter than the trusted chain', () => {
    expect(clientKey('x', '198.51.100.20', 3)).toBe('198.51.100.20');
  });

  it('uses the socket address behind a trusted proxy when the header is missing or empty', () => {
    expect(clientKey('192.0.2.10', null, 1)).toBe('192.0.2.10');
    expect(clientKey('192.0.2.10', ' , ', 1)).toBe('192.0.2.10');
  });
});

describe('rate_limits table', () => {
  it('has the columns rate-limiter-flexible’s PostgreSQL store writes (key, points, expire), in that order', async () => {
    const knex = testDb();
    try {
      const { rows } = await knex.raw(
        `SELECT column_name, data_type FROM information_schema.columns WHERE table_name = 'rate_limits' ORDER BY ordinal_position`,
      );
      // RateLimiterPostgres inserts "VALUES ($1, $2, $3)" without naming columns.
      expect(rows).toEqual([
        { column_name: 'key', data_type: 'character varying' },
        { column_name: 'points', data_type: 'integer' },
        { column_name: 'expire', data_type: 'bigint' },
      ]);
    } finally {
      await knex.destroy();
    }
  });

  it('keeps per-account limits tighter than per-address ones', () => {
    for (const spec of Object.values(limitSpecs)) expect(spec.perAccount.points).toBeLessThan(spec.perIp.points);
  });
});

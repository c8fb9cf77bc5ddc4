// A small pg Pool for Auth.js's PostgreSQL adapter (Knex keeps its own pool for everything else).
import pg from 'pg';
import { config, databaseUrl } from '../core/config';

let pool: pg.Pool | undefined;

export function authPool(): pg.Pool {
  pool ??= new pg.Pool({ connectionString: databaseUrl(config()), max: 4, idleTimeoutMillis: 30_000 });
  return pool;
}

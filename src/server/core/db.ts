// The one Knex instance of the app process.
import knexFactory, { type Knex } from 'knex';
import knexConfig from '../../../knexfile.js';

let instance: Knex | undefined;

/**
 * The server entry sets BENCHLORE_DB_WAIT_MS: how long a request may wait for a new connection or a query's answer
 * before it fails and is answered 503. Waiting for a pooled connection under load may take four times as long: while
 * PostgreSQL is away, that wait ends as soon as a connection attempt fails. Scripts leave it unset.
 */
export function knexSettings(waitMs = Number(process.env.BENCHLORE_DB_WAIT_MS ?? 0)): Knex.Config {
  if (!(waitMs > 0)) return knexConfig;
  return {
    ...knexConfig,
    acquireConnectionTimeout: waitMs * 4,
    connection: { connectionString: knexConfig.connection as string, connectionTimeoutMillis: waitMs, query_timeout: waitMs },
  };
}

export function db(): Knex {
  instance ??= knexFactory(knexSettings());
  return instance;
}

export async function closeDb(): Promise<void> {
  if (instance) await instance.destroy();
  instance = undefined;
}

// The one Knex instance of the app process.
import knexFactory, { type Knex } from 'knex';
import knexConfig from '../../../knexfile.js';

let instance: Knex | undefined;

/**
 * The server entry sets BENCHLORE_DB_WAIT_MS: how long a request may wait for a new connection before it fails and is
 * answered 503; a query's answer (row locks included) and a pooled connection may take 4/3 as long (2 s for 1.5 s),
 * so a busy moment is less often mistaken for an outage while every answer still comes within 5 s. Scripts leave it
 * unset and wait as long as it takes.
 */
export function knexSettings(waitMs = Number(process.env.BENCHLORE_DB_WAIT_MS ?? 0)): Knex.Config {
  if (!(waitMs > 0)) return knexConfig;
  return {
    ...knexConfig,
    acquireConnectionTimeout: Math.round((waitMs * 4) / 3),
    connection: {
      connectionString: knexConfig.connection as string,
      connectionTimeoutMillis: waitMs,
      query_timeout: Math.round((waitMs * 4) / 3),
    },
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

// The one Knex instance of the app process.
import knexFactory, { type Knex } from 'knex';
import knexConfig from '../../../knexfile.js';

let instance: Knex | undefined;

export function db(): Knex {
  instance ??= knexFactory(knexConfig);
  return instance;
}

export async function closeDb(): Promise<void> {
  if (instance) await instance.destroy();
  instance = undefined;
}

// Shared set-up for `npm start` and `npm test`: database up and migrated, demo world seeded, server built.
import { spawnSync } from 'node:child_process';
import { readConfig } from '../../src/server/core/config.ts';
import * as localPg from './local-pg.ts';
import { buildIsCurrent, distDir, markBuilt } from './build-stamp.ts';

export function run(cmd: string, args: string[], env: NodeJS.ProcessEnv = process.env): void {
  const res = spawnSync(cmd, args, { stdio: 'inherit', env });
  if (res.status !== 0) {
    console.error(`\n${cmd} ${args.join(' ')} failed (exit ${res.status ?? res.signal}).`);
    process.exit(res.status ?? 1);
  }
}

/** Starts the local cluster (unless DATABASE_URL is set) and makes sure the database exists. */
export async function ensureDatabase(env: NodeJS.ProcessEnv, options: { fresh?: boolean } = {}): Promise<void> {
  const config = readConfig(env);
  if (config.DATABASE_URL) return;
  const pg = localPg.locate(config.BENCHLORE_DATA_DIR, config.BENCHLORE_PG_PORT);
  localPg.init(pg);
  await localPg.start(pg);
  if (options.fresh) localPg.dropDatabase(pg, config.BENCHLORE_DB_NAME);
  localPg.ensureDatabase(pg, config.BENCHLORE_DB_NAME);
}

export function migrateAndSeed(env: NodeJS.ProcessEnv): void {
  run(process.execPath, ['--import', 'tsx', 'scripts/migrate.ts'], env);
  run(process.execPath, ['--import', 'tsx', 'scripts/seed.ts'], env);
}

export function buildIfStale(env: NodeJS.ProcessEnv): void {
  if (buildIsCurrent()) {
    console.log('The built server is up to date.');
    return;
  }
  run(process.execPath, ['node_modules/astro/astro.js', 'build', '--outDir', distDir], { ...env, NODE_ENV: 'production' });
  run(process.execPath, ['scripts/build-entry.mjs', distDir], env);
  markBuilt();
}

/**
 * For a script that works in a database of its own (benchmarks, the search evaluation): never the app's or a
 * test database, never Meilisearch, a fresh database every run (unless `fresh: false`, to measure again what a
 * previous run built). Sets this process's environment too, so the app's Knex, imported after this, connects to it.
 */
export async function useOwnDatabase(name: string, extra: NodeJS.ProcessEnv = {}, { fresh = true } = {}): Promise<NodeJS.ProcessEnv> {
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    BENCHLORE_DB_NAME: name,
    BENCHLORE_MEDIA_DIR: `${process.env.BENCHLORE_DATA_DIR ?? '.data'}/media-${name}`,
    LOG_LEVEL: 'warn',
    ...extra,
  };
  delete env.DATABASE_URL;
  delete env.MEILI_URL;
  delete env.SMTP_URL;
  Object.assign(process.env, env);
  delete process.env.MEILI_URL;
  readConfig(env);
  await ensureDatabase(env, { fresh });
  return env;
}

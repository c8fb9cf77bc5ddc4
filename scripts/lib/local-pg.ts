// The local PostgreSQL cluster used by `npm start` and `npm test`: Debian's server binaries, a cluster
// under the project's data folder, listening on 127.0.0.1 only. DATABASE_URL bypasses all of this.
import { execFileSync, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readlinkSync, lstatSync, symlinkSync, writeFileSync, appendFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import net from 'node:net';
import { installDebianPackage, isRoot } from './debian-packages.ts';

export interface LocalPg {
  binDir: string;
  clusterDir: string;
  socketDir: string;
  logFile: string;
  port: number;
  asRoot: boolean;
}

function findBinDir(): string | undefined {
  const base = '/usr/lib/postgresql';
  if (!existsSync(base)) return undefined;
  const versions = readdirSync(base)
    .filter((v) => existsSync(join(base, v, 'bin', 'initdb')))
    .sort((a, b) => Number(b) - Number(a));
  return versions[0] ? join(base, versions[0], 'bin') : undefined;
}

/** Installs Debian's postgresql when the server binaries are missing (as root), or explains how. */
export function ensureServerBinaries(): string {
  let bin = findBinDir();
  if (bin) return bin;
  installDebianPackage('postgresql', 'The local database', 'or set DATABASE_URL to a PostgreSQL server you already run.');
  bin = findBinDir();
  if (!bin) throw new Error('postgresql was installed but no initdb was found under /usr/lib/postgresql');
  return bin;
}

/** Runs a server binary as the postgres user when we are root (initdb refuses to run as root). */
function runPg(pg: LocalPg, tool: string, args: string[], opts: { quiet?: boolean; input?: string } = {}) {
  const cmd = pg.asRoot ? 'runuser' : join(pg.binDir, tool);
  const argv = pg.asRoot ? ['-u', 'postgres', '--', join(pg.binDir, tool), ...args] : args;
  return spawnSync(cmd, argv, {
    encoding: 'utf8',
    input: opts.input,
    stdio: [opts.input === undefined ? 'ignore' : 'pipe', opts.quiet ? 'pipe' : 'inherit', 'pipe'],
  });
}

function postgresCanReach(dir: string): boolean {
  return spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', dir]).status === 0;
}

/**
 * Decides where the cluster lives. It is `<data>/pg`; when the postgres user cannot traverse the
 * project folder (a clone under a private home folder), the cluster sits under /var/lib/benchlore and
 * `<data>/pg` is a symlink to it.
 */
export function locate(dataDir: string, port: number): LocalPg {
  const binDir = ensureServerBinaries();
  const data = resolve(dataDir);
  mkdirSync(data, { recursive: true });
  const link = join(data, 'pg');
  const asRoot = isRoot();
  let root = link;
  if (asRoot) {
    if (existsSync(link) && lstatSync(link).isSymbolicLink()) {
      root = readlinkSync(link);
    } else if (!existsSync(link) && !postgresCanReach(data)) {
      const id = createHash('sha256').update(data).digest('hex').slice(0, 12);
      root = join('/var/lib/benchlore', id);
      mkdirSync(root, { recursive: true });
      symlinkSync(root, link);
    }
  }
  mkdirSync(root, { recursive: true });
  const pg: LocalPg = {
    binDir,
    clusterDir: join(root, 'cluster'),
    socketDir: join(root, 'run'),
    logFile: join(root, 'postgres.log'),
    port,
    asRoot,
  };
  mkdirSync(pg.socketDir, { recursive: true });
  if (asRoot) execFileSync('chown', ['-R', 'postgres:postgres', root]);
  return pg;
}

export function isInitialised(pg: LocalPg): boolean {
  return existsSync(join(pg.clusterDir, 'PG_VERSION'));
}

export function init(pg: LocalPg): void {
  if (isInitialised(pg)) return;
  console.log(`Creating a PostgreSQL cluster in ${pg.clusterDir}`);
  const res = runPg(
    pg,
    'initdb',
    ['-D', pg.clusterDir, '-U', 'postgres', '--auth-local=peer', '--auth-host=scram-sha-256', '-E', 'UTF8', '--locale=C.UTF-8'],
    { quiet: true },
  );
  if (res.status !== 0) throw new Error(`initdb failed:\n${res.stdout}\n${res.stderr}`);
  // A local development and test cluster: durability settings are relaxed for speed. Production
  // uses its own server through DATABASE_URL.
  appendFileSync(
    join(pg.clusterDir, 'postgresql.conf'),
    [
      '',
      '# Benchlore local cluster',
      "listen_addresses = '127.0.0.1'",
      `unix_socket_directories = '${pg.socketDir}'`,
      'fsync = off',
      'synchronous_commit = off',
      'full_page_writes = off',
      'max_connections = 100',
      'shared_buffers = 128MB',
      '',
    ].join('\n'),
  );
}

export function isRunning(pg: LocalPg): boolean {
  return runPg(pg, 'pg_ctl', ['-D', pg.clusterDir, 'status'], { quiet: true }).status === 0;
}

function portTaken(port: number): Promise<boolean> {
  return new Promise((done) => {
    const socket = net.connect({ host: '127.0.0.1', port });
    socket.once('connect', () => (socket.destroy(), done(true)));
    socket.once('error', () => done(false));
  });
}

export async function start(pg: LocalPg): Promise<void> {
  if (isRunning(pg)) return;
  if (await portTaken(pg.port)) {
    throw new Error(`Port ${pg.port} on 127.0.0.1 is taken by another program. Stop it, or choose another port with BENCHLORE_PG_PORT.`);
  }
  const res = runPg(pg, 'pg_ctl', ['-D', pg.clusterDir, '-l', pg.logFile, '-w', '-t', '60', '-o', `-p ${pg.port}`, 'start'], {
    quiet: true,
  });
  if (res.status !== 0) throw new Error(`PostgreSQL did not start; see ${pg.logFile}\n${res.stderr}`);
}

export function stop(pg: LocalPg): void {
  if (!isRunning(pg)) return;
  runPg(pg, 'pg_ctl', ['-D', pg.clusterDir, '-m', 'fast', '-w', 'stop'], { quiet: true });
}

/** Runs SQL as the cluster's superuser over the private socket. */
export function superSql(pg: LocalPg, sql: string, database = 'postgres'): string {
  const res = runPg(
    pg,
    'psql',
    ['-X', '-q', '-t', '-A', '-v', 'ON_ERROR_STOP=1', '-h', pg.socketDir, '-p', String(pg.port), '-U', 'postgres', '-d', database],
    { quiet: true, input: sql },
  );
  if (res.status !== 0) throw new Error(`psql failed: ${res.stderr}`);
  return res.stdout.trim();
}

/** Creates the application role and a database it owns; safe to repeat. */
export function ensureDatabase(pg: LocalPg, name: string): void {
  superSql(
    pg,
    `DO $$ BEGIN
       IF NOT EXISTS (SELECT 1 FROM pg_roles WHERE rolname = 'benchlore') THEN
         CREATE ROLE benchlore LOGIN PASSWORD 'benchlore' CREATEDB;
       END IF;
     END $$;`,
  );
  const exists = superSql(pg, `SELECT 1 FROM pg_database WHERE datname = '${name}'`);
  if (exists !== '1') superSql(pg, `CREATE DATABASE ${name} OWNER benchlore`);
  // pg_trgm and unaccent are trusted extensions, but creating them here keeps migrations simple on
  // older servers too.
  superSql(pg, 'CREATE EXTENSION IF NOT EXISTS pg_trgm; CREATE EXTENSION IF NOT EXISTS unaccent;', name);
}

export function dropDatabase(pg: LocalPg, name: string): void {
  superSql(pg, `DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
}

export function writeNote(pg: LocalPg): void {
  writeFileSync(join(pg.clusterDir, '..', 'README.txt'), 'Local PostgreSQL cluster for Benchlore. Safe to delete when stopped.\n');
}

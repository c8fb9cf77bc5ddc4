// `npm run db -- <start|stop|status|ensure>`: manages the local PostgreSQL cluster.
import { readConfig } from '../src/server/core/config.ts';
import * as localPg from './lib/local-pg.ts';

const command = process.argv[2] ?? 'status';
const config = readConfig();

if (config.DATABASE_URL) {
  console.log('DATABASE_URL is set: the local cluster is not used.');
  process.exit(0);
}

const pg = localPg.locate(config.BENCHLORE_DATA_DIR, config.BENCHLORE_PG_PORT);

switch (command) {
  case 'ensure':
  case 'start':
    localPg.init(pg);
    await localPg.start(pg);
    if (command === 'ensure') localPg.ensureDatabase(pg, config.BENCHLORE_DB_NAME);
    console.log(`PostgreSQL is running on 127.0.0.1:${pg.port} (cluster ${pg.clusterDir}).`);
    break;
  case 'stop':
    localPg.stop(pg);
    console.log('PostgreSQL is stopped.');
    break;
  case 'status':
    console.log(localPg.isRunning(pg) ? `running on 127.0.0.1:${pg.port}` : 'stopped');
    break;
  default:
    console.error('usage: npm run db -- start|stop|status|ensure');
    process.exit(2);
}

// The app's server entry (`npm run preview`, and what `npm start` and the tests run): the built app's request handler
// in a node:http server of our own, with background work started at boot and everything stopped cleanly on SIGTERM.
// `npm run build` bundles it into dist/serve.mjs (scripts/build-entry.mjs), which runs under plain node.
import { existsSync, readFileSync } from 'node:fs';
import { createServer, type RequestListener } from 'node:http';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { startBackgroundWork } from '../src/server/core/background.ts';
import { closeDb } from '../src/server/core/db.ts';
import { logger } from '../src/server/core/logger.ts';
import { loadStaticFiles, serveStaticFile, type PrerenderedHeaders } from '../src/server/http/static-files.ts';

/** How long a stop waits for requests and jobs in flight before closing connections and returning jobs to their queue. */
const STOP_GRACE_MS = Number(process.env.BENCHLORE_STOP_GRACE_MS ?? 10_000);

// A request waits at most this long for PostgreSQL, then is answered 503 (src/server/core/db.ts), never left hanging.
process.env.BENCHLORE_DB_WAIT_MS ??= '1500';
const dist = resolve(process.env.BENCHLORE_DIST ?? 'dist');
// The adapter runs in middleware mode (astro.config.mjs): its handler renders pages and endpoints only; the built
// files are answered from memory first (src/server/http/static-files.ts), with the prerendered pages' headers.
const { handler: app } = (await import(pathToFileURL(resolve(dist, 'server', 'entry.mjs')).href)) as { handler: RequestListener };
const headersFile = resolve(dist, '_experimentalHeaders.json');
const prerendered = existsSync(headersFile) ? (JSON.parse(readFileSync(headersFile, 'utf8')) as PrerenderedHeaders) : [];
const files = loadStaticFiles(resolve(dist, 'client'), prerendered);

const handler: RequestListener = (req, res) => {
  try {
    decodeURI(req.url ?? '/');
  } catch {
    res.writeHead(400, { 'Content-Type': 'text/plain; charset=utf-8' });
    res.end('Bad request: the address is not valid, e.g. a lone "%" that does not start an escape like %20.');
    return;
  }
  if (!serveStaticFile(files, req, res)) app(req, res);
};

const port = Number(process.env.PORT ?? 4321);
const host = process.env.HOST ?? '127.0.0.1';

// A rejected promise nobody awaited (a queue library's bookkeeping while PostgreSQL restarts) is logged, not fatal.
process.on('unhandledRejection', (reason) => logger().error({ err: reason }, 'unhandled rejection'));

const background = startBackgroundWork();
const server = createServer(handler);
server.on('error', (error: NodeJS.ErrnoException) => {
  console.error(error.code === 'EADDRINUSE' ? `Port ${port} is already in use.` : error.message);
  process.exit(1);
});
server.listen(port, host, () => console.log(`Benchlore is listening on http://${host}:${port}`));

let stopping = false;
async function stop(signal: NodeJS.Signals): Promise<void> {
  if (stopping) return;
  stopping = true;
  logger().info({ signal }, 'stopping: no new requests; finishing those in flight and the background work in hand');
  const closed = new Promise<void>((done) => server.close(() => done()));
  server.closeIdleConnections();
  const force = setTimeout(() => server.closeAllConnections(), STOP_GRACE_MS);
  force.unref();
  await Promise.all([closed, background.stop(STOP_GRACE_MS)]);
  await closeDb();
  process.exit(0);
}
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => void stop(signal));

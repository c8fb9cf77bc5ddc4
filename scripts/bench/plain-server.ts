// Plain node:http serving the fix page's bytes: the ceiling beside the framework's floor in `npm run bench`.
import { createServer } from 'node:http';
import { readFileSync } from 'node:fs';

const body = readFileSync(process.env.BENCH_BYTES_FILE ?? '');
createServer((_req, res) => {
  res.writeHead(200, { 'Content-Type': 'text/html; charset=utf-8', 'Content-Length': body.length });
  res.end(body);
}).listen(Number(process.env.PORT), '127.0.0.1', () => console.log('listening'));

// A TCP proxy in front of PostgreSQL that a test can cut (the database goes away), stall (it stops answering) and restore.
import { createServer, connect, type Server, type Socket } from 'node:net';

export interface DbProxy {
  port: number;
  /** Drops every connection and refuses new ones, as a stopped PostgreSQL does. */
  cut(): Promise<void>;
  /** Accepts connections but forwards nothing either way: queries and connects hang, as with a lost network. */
  stall(): void;
  /** Forwards again; connections cut or stalled meanwhile are closed, as a restarted PostgreSQL would have. */
  restore(): Promise<void>;
  close(): Promise<void>;
}

export async function startDbProxy(targetPort: number): Promise<DbProxy> {
  const pairs = new Set<[Socket, Socket]>();
  let stalled = false;
  const stalledPairs = new Set<[Socket, Socket]>();

  const onConnection = (client: Socket) => {
    const upstream = connect(targetPort, '127.0.0.1');
    const pair: [Socket, Socket] = [client, upstream];
    pairs.add(pair);
    const drop = () => {
      client.destroy();
      upstream.destroy();
      pairs.delete(pair);
      stalledPairs.delete(pair);
    };
    client.on('error', drop).on('close', drop);
    upstream.on('error', drop).on('close', drop);
    if (stalled) {
      stalledPairs.add(pair);
      return;
    }
    client.pipe(upstream);
    upstream.pipe(client);
  };

  let server: Server = createServer(onConnection);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const port = (server.address() as { port: number }).port;

  const dropAll = () => {
    for (const [client, upstream] of pairs) {
      client.destroy();
      upstream.destroy();
    }
    pairs.clear();
    stalledPairs.clear();
  };
  const listen = async () => {
    server = createServer(onConnection);
    await new Promise<void>((resolve) => server.listen(port, '127.0.0.1', resolve));
  };
  const closeListener = () => new Promise<void>((resolve) => server.close(() => resolve()));

  return {
    port,
    async cut() {
      const closed = closeListener();
      dropAll();
      await closed;
    },
    stall() {
      stalled = true;
      for (const pair of pairs) {
        pair[0].unpipe();
        pair[1].unpipe();
        stalledPairs.add(pair);
      }
    },
    async restore() {
      stalled = false;
      if (server.listening) {
        // Stalled: the connections that hung are closed, new ones forwarded.
        dropAll();
        return;
      }
      await listen();
    },
    async close() {
      const closed = server.listening ? closeListener() : Promise.resolve();
      dropAll();
      await closed;
    },
  };
}

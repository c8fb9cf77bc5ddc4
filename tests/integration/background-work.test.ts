// Background work starts with the server, before any request, and stops cleanly: mail in hand is finished or returned to the outbox.
import { createServer, type Server, type Socket } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { storage } from '@/server/storage';
import { closeDb } from '@/server/core/db';
import { enqueueMail } from '@/server/mail/outbox';
import { testDb } from '../support/db';
import { startApp } from '../support/server';
import { INTEGRATION_PORT, sinkPortFor } from '../support/test-env';
import { createUser, uniqueEmail } from '../support/sign-in';
import { storedPhotoRow } from '../support/photo-rows';
import { mailsTo, waitForMail } from '../support/mail';

// A server of its own (the shared one has long since started); +7 is the production mail check's, +11 the outbox test's.
const port = INTEGRATION_PORT + 3;
const knex = testDb();
let ownerId: number;

// enqueueMail below runs in this test process and must write to the outbox of the server on `port` (read once, by config()).
process.env.SMTP_SINK_PORT = String(sinkPortFor(port));

beforeAll(async () => {
  ownerId = (await createUser(knex, { tag: 'bg-photos' })).id;
});
afterAll(async () => {
  await closeDb();
  await knex.destroy();
});

/** An unattached upload from two days ago, with one stored rendition: what the cleanup removes. */
const abandonedPhoto = () => storedPhotoRow(knex, ownerId, { hoursAgo: 48, tag: 'background', altText: 'A photo nobody used' });

const deletedAt = async (id: number): Promise<Date | null> => (await knex('photos').where({ id }).first('deleted_at')).deleted_at;

const mailJob = (id: string) => knex('pgboss.job').where({ id }).first('state', 'retry_count');

async function until<T>(what: string, read: () => Promise<T>, ok: (value: T) => boolean, timeoutMs = 15_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await read();
    if (ok(value)) return value;
    if (Date.now() > deadline) throw new Error(`${what}: still ${JSON.stringify(value)} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** An SMTP relay that accepts the connection and then says nothing: a message is "in flight" for as long as we like. */
async function silentRelay(onPort: number): Promise<{ close(): Promise<void> }> {
  const sockets = new Set<Socket>();
  const server: Server = createServer((socket) => {
    sockets.add(socket);
    socket.on('close', () => sockets.delete(socket));
  });
  await new Promise<void>((resolve) => server.listen(onPort, '127.0.0.1', resolve));
  return {
    close: () =>
      new Promise<void>((resolve) => {
        for (const socket of sockets) socket.destroy();
        server.close(() => resolve());
      }),
  };
}

describe('background work', () => {
  it('removes abandoned photos and sends waiting mail once a fresh server is listening, with no request at all', async () => {
    const photo = await abandonedPhoto();
    const to = uniqueEmail('bg-boot');
    await enqueueMail({ to, subject: 'Queued before the server started', text: 'Hello', html: '<p>Hello</p>' });
    // The servers already running ran their start-up cleanup before this photo existed; the next is an hour away.
    await new Promise((r) => setTimeout(r, 1_000));
    expect(await deletedAt(photo.id)).toBeNull();

    // startApp resolves when the server says it is listening; nobody sends it a request in this test.
    const app = await startApp(port);
    try {
      await until(
        'the abandoned photo',
        () => deletedAt(photo.id),
        (at) => at !== null,
      );
      expect(await storage().get(photo.key)).toBeNull();
      await waitForMail(port, to, { subject: 'Queued before the server started', timeoutMs: 15_000 });
    } finally {
      expect(await app.stop()).toBe(0);
    }
  }, 60_000);

  it('on SIGTERM returns a message it could not finish to the outbox, exits 0, and the next server sends it once', async () => {
    // The relay answers the connection but never greets: the message stays in flight until the server stops.
    const relay = await silentRelay(sinkPortFor(port));
    const to = uniqueEmail('bg-stop');
    const app = await startApp(port, { BENCHLORE_STOP_GRACE_MS: '1500' }, { sink: false });
    let id = '';
    try {
      id = await enqueueMail({ to, subject: 'In flight at shutdown', text: 'Hello', html: '<p>Hello</p>' });
      await until(
        'the job',
        () => mailJob(id),
        (job) => job?.state === 'active',
      );
      const stopping = Date.now();
      expect(await app.stop()).toBe(0);
      // Stopped after the grace period, not after the relay's 30 s greeting timeout.
      expect(Date.now() - stopping).toBeLessThan(8_000);
      expect(await mailJob(id)).toMatchObject({ state: 'retry' });
      expect(app.output()).not.toMatch(/\n\s+at .+:\d+:\d+\)?\n/);
    } finally {
      await relay.close();
    }

    // A real relay now: the next server sends the returned message exactly once.
    const next = await startApp(port);
    try {
      await waitForMail(port, to, { subject: 'In flight at shutdown', timeoutMs: 20_000 });
      await new Promise((r) => setTimeout(r, 2_000));
      expect(await mailsTo(port, to)).toHaveLength(1);
      expect(await mailJob(id)).toMatchObject({ state: 'completed' });
    } finally {
      await next.stop();
    }
  }, 60_000);
});

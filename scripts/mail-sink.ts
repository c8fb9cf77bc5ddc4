// A local SMTP sink on 127.0.0.1: accepts every message and keeps it as JSON under <data>/mail (or BENCHLORE_MAIL_DIR).
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';
import { readConfig } from '../src/server/core/config.ts';
import { mailDir, storeMail } from '../src/server/mail/sink-store.ts';

const config = readConfig();
const dir = mailDir(config);
const port = config.SMTP_SINK_PORT;
/** Messages larger than this are refused: the sink holds account mail, not attachments. */
const MAX_MESSAGE_BYTES = 2 * 1024 * 1024;

function addresses(value: AddressObject | AddressObject[] | undefined): string[] {
  const list = value === undefined ? [] : Array.isArray(value) ? value : [value];
  return list.flatMap((group) => group.value.map((entry) => entry.address ?? '')).filter((address) => address !== '');
}

const server = new SMTPServer({
  // Without these, nodemailer tries to upgrade or log in and Auth.js's provider fails on "Missing credentials".
  disabledCommands: ['STARTTLS', 'AUTH'],
  authOptional: true,
  logger: false,
  size: MAX_MESSAGE_BYTES,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then(async (parsed) => {
        const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
        const to = addresses(parsed.to);
        await storeMail(dir, {
          from: parsed.from?.text ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : ''),
          to: to.length > 0 ? to : envelopeTo,
          subject: parsed.subject ?? '',
          text: parsed.text ?? '',
          html: typeof parsed.html === 'string' ? parsed.html : '',
          date: (parsed.date ?? new Date()).toISOString(),
          // The list headers as sent (e.g. one-click unsubscribe), so tests can follow them as a mail program would.
          headers: Object.fromEntries(
            parsed.headerLines.filter((h) => h.key.startsWith('list-')).map((h) => [h.key, h.line.slice(h.line.indexOf(':') + 1).trim()]),
          ),
        });
        callback();
      })
      .catch((error: unknown) => callback(error instanceof Error ? error : new Error(String(error))));
  },
});

server.on('error', (error: NodeJS.ErrnoException) => {
  console.error(`mail sink: ${error.code === 'EADDRINUSE' ? `port ${port} is already in use` : error.message}`);
  process.exit(1);
});

server.listen(port, '127.0.0.1', () => {
  console.log(`mail sink listening on 127.0.0.1:${port}, keeping messages in ${dir}`);
});

for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => server.close(() => process.exit(0)));
}

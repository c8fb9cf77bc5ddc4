// The one nodemailer transport: SMTP_URL when set, otherwise the local sink on 127.0.0.1.
import { createTransport, type Transporter } from 'nodemailer';
import type SMTPTransport from 'nodemailer/lib/smtp-transport';
import { config, type Config } from '../core/config';

/** Connection settings, also handed to Auth.js's Nodemailer provider so both send the same way. */
export function smtpServer(settings: Pick<Config, 'SMTP_URL' | 'SMTP_SINK_PORT'> = config()): string | SMTPTransport.Options {
  if (settings.SMTP_URL) return settings.SMTP_URL;
  // The sink speaks plain SMTP on loopback only: no TLS upgrade, no login.
  return { host: '127.0.0.1', port: settings.SMTP_SINK_PORT, secure: false, ignoreTLS: true, connectionTimeout: 10_000 };
}

let instance: Transporter<SMTPTransport.SentMessageInfo> | undefined;

export function mailTransport(): Transporter<SMTPTransport.SentMessageInfo> {
  instance ??= createTransport(smtpServer());
  return instance;
}

// One pino logger for the server.
import pino from 'pino';
import { config } from './config';

let instance: pino.Logger | undefined;

export function logger(): pino.Logger {
  instance ??= pino({ level: config().NODE_ENV === 'test' ? 'warn' : config().LOG_LEVEL });
  return instance;
}

// Auth.js's log lines into our logger; a wrong password is routine, not an error.
import type { AuthConfig } from '@auth/core';
import { logger } from '../core/logger';

const routine = new Set(['CredentialsSignin', 'Verification', 'AccessDenied', 'MissingCSRF']);

export const authLogger: NonNullable<AuthConfig['logger']> = {
  error(error: Error & { type?: string }) {
    if (error.type && routine.has(error.type)) logger().info({ authError: error.type }, 'sign-in refused');
    else logger().error({ err: error }, 'Auth.js error');
  },
  warn(code: string) {
    logger().warn({ authWarning: code }, 'Auth.js warning');
  },
  debug(message: string, metadata?: unknown) {
    logger().debug({ metadata }, message);
  },
};

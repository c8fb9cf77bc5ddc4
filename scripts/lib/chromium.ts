// Browser tests drive Debian's Chromium (never a downloaded browser); this makes sure it is there.
import { existsSync } from 'node:fs';
import { installDebianPackage } from './debian-packages.ts';

export const defaultChromiumPath = '/usr/bin/chromium';

export function ensureChromium(env: NodeJS.ProcessEnv): void {
  const path = env.CHROMIUM_PATH ?? defaultChromiumPath;
  if (existsSync(path)) return;
  if (env.CHROMIUM_PATH) {
    console.error(`CHROMIUM_PATH is set to ${path}, but no file is there.`);
    process.exit(1);
  }
  installDebianPackage('chromium', 'The browser tests', 'or set CHROMIUM_PATH to a Chromium you already have.');
  if (!existsSync(path)) throw new Error(`chromium was installed but ${path} is missing`);
}

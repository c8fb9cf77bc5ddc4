// Debian packages our scripts need (the PostgreSQL server, Chromium for browser tests): installed with
// apt-get when we run as root, otherwise the exact command is printed and the script stops.
import { execFileSync } from 'node:child_process';

export const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;

export function installDebianPackage(pkg: string, purpose: string, alternative?: string): void {
  if (!isRoot()) {
    console.error(
      `${purpose} needs Debian's ${pkg} package. Install it once with:\n\n` +
        `  sudo apt-get update && sudo apt-get install -y ${pkg}\n` +
        (alternative ? `\n${alternative}\n` : ''),
    );
    process.exit(1);
  }
  console.log(`Installing Debian's ${pkg} package for ${purpose.toLowerCase()} (first run only)...`);
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' });
  execFileSync('apt-get', ['install', '-y', '-qq', pkg], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
}

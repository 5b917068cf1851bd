/** Installs Debian packages the project needs at run or test time, when their command is missing. */
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';

export interface DebianNeed {
  command: string;
  path: string;
  pkg: string;
}

let updated = false;

/** apt-get installs every package whose command is not on this machine yet. */
export function ensureDebianPackages(needs: DebianNeed[]): void {
  const missing = needs.filter((n) => !existsSync(n.path));
  if (missing.length === 0) return;
  const pkgs = missing.map((n) => n.pkg);
  console.log(`Installing Debian packages: ${pkgs.join(' ')}`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  if (!updated) {
    execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
    updated = true;
  }
  execFileSync('apt-get', ['install', '-y', '-qq', ...pkgs], { stdio: 'inherit', env });
}

// Installs the locked dependencies when node_modules is missing or older than the lockfile,
// so `npm start` and `npm test` work on a fresh clone with no other step.
import { existsSync, statSync } from 'node:fs';
import { spawnSync } from 'node:child_process';

const lock = 'package-lock.json';
const marker = 'node_modules/.package-lock.json';
const stale = !existsSync(marker) || statSync(marker).mtimeMs < statSync(lock).mtimeMs;
if (stale) {
  console.error('tenorscope: installing locked dependencies (npm ci)...');
  const r = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { stdio: 'inherit' });
  if (r.status !== 0) process.exit(r.status ?? 1);
}

// Makes sure Debian's Chromium is at /usr/bin/chromium for the browser tests (and poppler-utils'
// pdftoppm for turning printed pages into images). As root with apt-get it installs what is
// missing; otherwise, or if the install fails, it exits non-zero with the command to run.
// Browser tests are never skipped for want of a browser: they fail, saying so.
import { existsSync } from 'node:fs';
import { spawnSync } from 'node:child_process';

const CHROMIUM = '/usr/bin/chromium';
const INSTALL = 'apt-get update && apt-get install -y chromium poppler-utils';

const onPath = (cmd) => spawnSync('sh', ['-c', `command -v ${cmd}`], { stdio: 'ignore' }).status === 0;
const missing = () => [!existsSync(CHROMIUM) && 'chromium', !onPath('pdftoppm') && 'poppler-utils'].filter(Boolean);

if (missing().length > 0) {
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (isRoot && onPath('apt-get')) {
    console.error(`tenorscope: installing ${missing().join(', ')} (${INSTALL})...`);
    const r = spawnSync('sh', ['-c', INSTALL], {
      stdio: ['ignore', 'inherit', 'inherit'],
      env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
    });
    if (r.status !== 0) console.error(`tenorscope: the install exited with status ${r.status ?? r.signal}`);
  }
}

if (!existsSync(CHROMIUM)) {
  console.error(
    `tenorscope: Chromium is missing at ${CHROMIUM}; the browser tests will fail without it.\n` +
      `  Install it as root with:\n    ${INSTALL}`,
  );
  process.exit(1);
}
if (!onPath('pdftoppm')) {
  console.error(`tenorscope: pdftoppm (poppler-utils) is missing; tests that render printed pages need it.\n  Install it as root with:\n    ${INSTALL}`);
}
const version = spawnSync(CHROMIUM, ['--version'], { encoding: 'utf8' });
if (version.status !== 0) {
  console.error(`tenorscope: ${CHROMIUM} --version failed (status ${version.status ?? version.signal}):\n${version.stderr}`);
  process.exit(1);
}
console.log(`tenorscope: ${version.stdout.trim()}`);

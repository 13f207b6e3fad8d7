// `npm test`: installs what is missing, makes sure Chromium is there, then runs every stage:
//   types   (tsc --noEmit)                          counts as 1 test
//   spec    (vitest: unit and component tests)      report test/artifacts/spec.json
//   browser (vite build, then vitest + Chromium)    report test/artifacts/browser.json
// Every stage runs even when an earlier one failed, so all counts are reported; then
// test/tools/summary.mjs prints the totals as the last line and sets the exit status.
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { spawnSync } from 'node:child_process';

const ARTIFACTS = 'test/artifacts';
mkdirSync(ARTIFACTS, { recursive: true });
for (const stale of ['stages.json', 'summary.json', 'spec.json', 'browser.json']) {
  rmSync(`${ARTIFACTS}/${stale}`, { force: true });
}

const steps = [];
const save = () => writeFileSync(`${ARTIFACTS}/stages.json`, JSON.stringify({ steps }, null, 2) + '\n');

function run(name, kind, title, cmd, args, report) {
  const command = [cmd, ...args].join(' ');
  console.log(`\n== tenorscope test: ${name}: ${title} ==`);
  const r = spawnSync(cmd, args, { stdio: 'inherit' });
  if (r.signal === 'SIGINT' || r.signal === 'SIGTERM') {
    console.error(`tenorscope: ${name} stopped by ${r.signal}`);
    process.exit(130);
  }
  const status = r.error ? `error: ${r.error.message}` : (r.status ?? `signal ${r.signal}`);
  steps.push({ name, kind, command, status, ...(report ? { report } : {}) });
  save();
  return status === 0;
}

const summary = () => {
  const r = spawnSync(process.execPath, ['test/tools/summary.mjs'], { stdio: 'inherit' });
  process.exit(r.status ?? 1);
};

if (!run('install', 'setup', 'locked dependencies', process.execPath, ['test/tools/ensure-install.mjs'])) {
  console.error('tenorscope: dependencies could not be installed; no stage can run');
  summary();
}
run('chromium', 'setup', 'Debian Chromium for the browser stage', process.execPath, ['test/tools/ensure-chromium.mjs']);
run('types', 'check', 'type check', 'npm', ['run', '--silent', 'test:types']);
run('spec', 'vitest', 'unit and component tests', 'npm', ['run', '--silent', 'test:spec'], `${ARTIFACTS}/spec.json`);
run('browser', 'vitest', 'build, then browser tests in Chromium', 'npm', ['run', '--silent', 'test:browser'], `${ARTIFACTS}/browser.json`);
summary();

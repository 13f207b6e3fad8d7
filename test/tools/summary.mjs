// Adds up the stages of `npm test` (test/tools/test-all.mjs writes test/artifacts/stages.json):
// the type check counts as one test, each vitest stage counts the tests in its JSON report.
// Tests a file could not run because it failed outside them (a beforeAll hook that threw, say,
// when Chromium will not start) count as failed, not skipped. A stage that failed with no
// failing test to show for it (a build error, a missing report, no tests at all) counts as one
// failed test, so a red run never shows "0 failed". The last line printed is exactly
// `N passed, N failed`. Each failed test is named just above it, with the first line of its
// failure, so the tail of a CI log says what failed.
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

const ARTIFACTS = 'test/artifacts';
const notes = [];
const rows = [];
let passed = 0;
let failed = 0;

function finish() {
  for (const row of rows) console.log(row);
  for (const note of notes) console.log(`  ! ${note}`);
  writeFileSync(`${ARTIFACTS}/summary.json`, JSON.stringify({ passed, failed, notes }, null, 2) + '\n');
  console.log(`${passed} passed, ${failed} failed`);
  process.exit(failed > 0 ? 1 : 0);
}

const readJson = (file) => {
  try {
    return JSON.parse(readFileSync(file, 'utf8'));
  } catch (error) {
    return { error };
  }
};

console.log('\n== tenorscope test summary ==');
const stagesFile = `${ARTIFACTS}/stages.json`;
const stages = existsSync(stagesFile) ? readJson(stagesFile) : { error: new Error('missing') };
if (stages.error || !Array.isArray(stages.steps)) {
  notes.push(`${stagesFile} is missing or unreadable: run the whole suite with \`npm test\``);
  failed += 1;
  finish();
}

for (const step of stages.steps) {
  const ok = step.status === 0;
  if (step.kind === 'setup') {
    if (!ok) notes.push(`${step.name}: ${step.command} exited with status ${step.status}`);
    continue;
  }
  if (step.kind === 'check') {
    passed += ok ? 1 : 0;
    failed += ok ? 0 : 1;
    rows.push(`  ${step.name.padEnd(8)} ${ok ? 'passed' : 'FAILED'} (counts as 1 test)  ${step.command}`);
    continue;
  }
  // vitest stage
  const report = existsSync(step.report) ? readJson(step.report) : null;
  if (report === null || report.error || typeof report.numTotalTests !== 'number') {
    failed += 1;
    rows.push(`  ${step.name.padEnd(8)} no report (counts as 1 failed)  ${step.command}`);
    notes.push(`${step.name}: ${step.report} ${report === null ? 'was not written' : 'is unreadable'}; the stage exited with status ${step.status}`);
    continue;
  }
  let p = 0;
  let f = 0;
  let skipped = 0;
  for (const file of report.testResults ?? []) {
    const tests = file.assertionResults ?? [];
    const count = (status) => tests.filter((t) => t.status === status).length;
    p += count('passed');
    f += count('failed');
    for (const t of tests.filter((x) => x.status === 'failed')) {
      const why = String(t.failureMessages?.[0] ?? '').split('\n')[0].replace(/\u001b\[[0-9;]*m/g, '').slice(0, 200);
      notes.push(`${step.name} FAILED: ${path.relative(process.cwd(), String(file.name))} > ${t.fullName ?? t.title}: ${why}`);
    }
    const notRun = tests.length - count('passed') - count('failed');
    if (file.status === 'failed' && count('failed') === 0) {
      // The file failed outside any test (a beforeAll hook, or it would not load): the tests it
      // did not run are failures, not skips. A file with no tests collected counts as one.
      const counted = Math.max(notRun, 1);
      f += counted;
      const why = String(file.message ?? '').split('\n')[0];
      notes.push(`${step.name}: ${path.relative(process.cwd(), String(file.name))} failed outside its tests (${why}): ${counted} test(s) counted as failed`);
    } else {
      skipped += notRun;
    }
  }
  if (p + f + skipped === 0) {
    f += 1;
    notes.push(`${step.name}: ran no tests`);
  } else if (!ok && f === 0) {
    f += 1;
    notes.push(`${step.name}: exited with status ${step.status} though no test failed (a file that failed to load, an error outside a test, or a build failure): counted as 1 failed`);
  }
  if (skipped > 0) notes.push(`${step.name}: ${skipped} test(s) skipped or todo, counted neither passed nor failed`);
  passed += p;
  failed += f;
  rows.push(`  ${step.name.padEnd(8)} ${String(p).padStart(4)} passed ${String(f).padStart(4)} failed  ${step.command}  (${step.report})`);
}

// A failed setup step (install, Chromium) with nothing else failing must still fail the run.
if (failed === 0 && stages.steps.some((s) => s.status !== 0)) {
  failed += 1;
  notes.push('a setup step failed: counted as 1 failed');
}
finish();

// Sensitivity-map benchmark (run: `npm run bench:engine`, bundled by esbuild; outside
// `npm test`). On the committed, invented 40-quote market (test/fixtures/market40) it times the
// whole forward-sensitivity map a user asks for in the workbench: compile the quotes, bootstrap,
// the forwards (3M every 1Y, simple, ACT/365F) and every forward's sensitivity to every quote
// (sensitivityMapFor). Targets from the issue on fits, bond analytics and sensitivities:
//   40-quote sensitivity map, log-linear-discount   median <= 5 ms
//   40-quote sensitivity map, monotone-convex       median <= 50 ms
// Also printed, without a target: a Nelson-Siegel and a Svensson fit of the same market, and bond
// analytics with key-rate durations. Medians over >= 200 timed runs after a warm-up. Exits 1 on a miss.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { analyzeBond, buildCurve, fitCurve, sensitivityMapFor, validateWorkspace, type InterpolationId } from '../../src/core/index.ts';
import { machineReferenceLine } from './machineReference.ts';

// npm scripts run at the repository root; the bench itself runs bundled (test/tools/run-ts.mjs).
const fixtures = join(process.cwd(), 'test', 'fixtures');
const doc = JSON.parse(readFileSync(join(fixtures, 'market40', 'market40.json'), 'utf8')) as Record<string, unknown>;
const ws = validateWorkspace(doc).workspace;
if (!ws) throw new Error('market40 does not validate');

const now = (): number => Number(process.hrtime.bigint()) / 1e6; // milliseconds
function timeMedian(f: () => void, runs: number, warm: number): number {
  for (let i = 0; i < warm; i++) f();
  const xs: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = now();
    f();
    xs.push(now() - t0);
  }
  xs.sort((a, b) => a - b);
  return xs[xs.length >> 1]!;
}

let failed = false;
const report = (what: string, ms: number, target: number | null): void => {
  const verdict = target === null ? '' : ms <= target ? `  ok (target <= ${target} ms)` : `  MISSED (target <= ${target} ms)`;
  if (target !== null && ms > target) failed = true;
  console.log(`${what.padEnd(58)} ${ms.toFixed(3).padStart(9)} ms${verdict}`);
};

for (const [interpolation, target] of [['log-linear-discount', 5], ['monotone-convex', 50]] as [InterpolationId, number][]) {
  const probe = sensitivityMapFor(ws, { interpolation });
  if (!probe.ok) throw new Error(`${interpolation}: ${probe.errors[0]?.message}`);
  const { map } = probe.value;
  const ms = timeMedian(() => void sensitivityMapFor(ws, { interpolation }), 200, 20);
  report(`sensitivity map ${map.rows.length} x ${map.columns.length}, ${interpolation}`, ms, target);
}
for (const model of ['nelson-siegel', 'svensson'] as const) {
  report(`${model} fit, 40 quotes`, timeMedian(() => void fitCurve(ws, { model }), 10, 2), null);
}
const curve = buildCurve(doc).curve!;
const bond = { maturity: '2036-05-15', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA' as const, cleanPrice: 101 };
report('bond analytics with 10 key rates', timeMedian(() => void analyzeBond(curve, bond), 500, 50), null);
console.log(machineReferenceLine());
if (failed) process.exitCode = 1;

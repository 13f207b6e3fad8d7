import { describe, expect, it } from 'vitest';
import {
  bumpedForwardSensitivities,
  buildCurve,
  explainForwardSensitivity,
  INTERPOLATIONS,
  sensitivityMapFor,
  type Explanation,
  type InterpolationId,
} from '../../../src/core/index.ts';
import { expectRelClose } from '../../helpers/asserts.ts';
import { INVENTED_2027_EVERY_KIND, workspaceDoc } from '../../helpers/markets.ts';

// A cell of the forward-sensitivity heat map explained (issue 19). Claims:
// 1. the explanation is forwardSensitivities run on the cell's row with a trace, and ends in the
//    map's figure (sensitivityMapFor, what the heat map shows) bit for bit, under every method;
// 2. its steps recomputed here from the shown inputs give each shown value to 1e-15 relative: ln P
//    from the two reads, the simple forward (1/P - 1) / tau and its slope dF/dL = -exp(-L) / tau
//    (Hull, "Options, Futures and Other Derivatives", forward rates; cited from memory), each g_j
//    from its shown partials, and dF/dq = sum_j g_j m_j (the chain rule through the nodes: the
//    implicit-function theorem on the bootstrap's pricing equations, e.g. Hagan and West (2006) on
//    risk from a bootstrapped curve, cited from memory);
// 3. on log-linear discount the shown node partials (inputs of the steps) are the interpolation
//    weights read off the shown nodes, (t - t1) / (t2 - t1), to the partials' rounding, 2e-14 (Hagan and West 2006, from memory);
// 4. the figure agrees with bump-and-rebuild (each quote moved +-1 bp through its own yield).
// The market is invented (test/helpers/markets.ts).

const doc = (method: InterpolationId) => workspaceDoc(INVENTED_2027_EVERY_KIND, { interpolation: method });
const TENOR = { n: 3, unit: 'M' } as const;
const STEP = { n: 1, unit: 'Y' } as const;

function mapUnder(method: InterpolationId) {
  const ws = buildCurve(doc(method)).workspace!;
  const m = sensitivityMapFor(ws, { interpolation: method, tenor: TENOR, step: STEP, compounding: 'simple' });
  if (!m.ok) throw new Error(m.errors[0]!.message);
  return m.value;
}

const at = (e: Explanation, name: string): number => {
  const v = e.steps.find((s) => s.name === name)?.value ?? e.yearFractions.find((y) => y.name === name)?.value;
  if (v === undefined) throw new Error(`no ${name}`);
  return v;
};
const read = (e: Explanation, name: string) => e.reads.find((r) => r.name === name)!;

describe('explainForwardSensitivity', () => {
  it.each(INTERPOLATIONS.map((m) => [m]))('ends in the heat map’s figure bit for bit and recomputes from its shown inputs (%s)', (method) => {
    const { map, curve, instruments } = mapUnder(method);
    const n = map.columns.length;
    let partialsChecked = 0;
    map.rows.forEach((row, i) => {
      for (let k = 0; k < n; k++) {
        const r = explainForwardSensitivity(curve, instruments, row, k, map.compounding, map.dayCount);
        if (!r.ok) throw new Error(r.errors[0]!.message);
        const e = r.value;
        const where = `${method} row ${row.start} quote ${k}`;
        const figure = map.values[i * n + k]!;
        expect(Object.is(e.value, figure), where).toBe(true);
        expect(Object.is(e.steps.at(-1)!.value, figure), where).toBe(true);
        expect(e.quantity).toBe('forward-sensitivity');
        // (2) each step from its shown inputs.
        const L = read(e, 'DF(end)').lnDiscount - read(e, 'DF(start)').lnDiscount;
        expect(at(e, 'L')).toBe(L);
        const tau = at(e, 'tau');
        expectRelClose(at(e, 'F'), Math.expm1(-L) / tau, 1e-15, `${where}: F = (1/P - 1) / tau`);
        expect(at(e, 'F')).toBe(row.rate);
        expectRelClose(at(e, 'dF/dL'), -Math.exp(-L) / tau, 1e-15, `${where}: dF/dL = -exp(-L) / tau`);
        let sum = 0;
        for (const s of e.steps) {
          const g = /^g(\d+)$/.exec(s.name);
          if (!g) continue;
          const j = g[1]!;
          expectRelClose(s.value, at(e, 'dF/dL') * (at(e, `dE${j}`) - at(e, `dS${j}`)), 1e-15, `${where}: g${j}`, 1e-300);
          sum += s.value * at(e, `m${j}`);
        }
        expectRelClose(sum, figure, 1e-15, `${where}: dF/dq = sum g_j m_j`, 1e-300);
        // (3) on log-linear discount, the partials are the interpolation weights of the shown nodes.
        if (method === 'log-linear-discount') {
          for (const side of ['end', 'start'] as const) {
            const rd = read(e, side === 'end' ? 'DF(end)' : 'DF(start)');
            if (rd.how !== 'interpolated' || rd.nodes[0]!.quote === null) continue;
            const [a, b] = rd.nodes;
            const jb = curve.pillars.findIndex((p) => p.date === b!.date) + 1;
            const wb = (rd.t - a!.t) / (b!.t - a!.t);
            const name = `${side === 'end' ? 'dE' : 'dS'}${jb}`;
            if (e.steps.some((s) => s.name === name)) {
              // An input, not a step: nodePartials takes it as a central difference at a node step of
              // 0.01 (exact in real arithmetic for a method linear in the nodes; its rounding about 1e-14).
              expectRelClose(at(e, name), wb, 1e-15, `${where}: ${name} = (t - t1) / (t2 - t1)`, 2e-14);
              partialsChecked++;
            }
          }
        }
      }
    });
    if (method === 'log-linear-discount') expect(partialsChecked).toBeGreaterThan(20);
  });

  it('agrees with bump and rebuild (+-1 bp through each quote’s own yield)', () => {
    const { map, curve, instruments } = mapUnder('log-linear-discount');
    const settings = { settlement: curve.settlement, dayCount: curve.dayCount, interpolation: curve.interpolation, extrapolation: curve.extrapolation };
    const bumped = bumpedForwardSensitivities(settings, instruments, map.rows, map.compounding);
    if (!bumped.ok) throw new Error(bumped.errors[0]!.message);
    const n = map.columns.length;
    let checked = 0;
    map.rows.forEach((row, i) => {
      for (let k = 0; k < n; k++) {
        const b = bumped.value[i * n + k]!;
        if (Math.abs(b) < 1e-3) continue;
        const r = explainForwardSensitivity(curve, instruments, row, k, map.compounding, map.dayCount);
        if (!r.ok) throw new Error('explain');
        expectRelClose(r.value.value, b, 1e-5, `row ${row.start} quote ${k}: central difference of a rebuilt curve`);
        checked++;
      }
    });
    expect(checked).toBeGreaterThan(10);
  });
});

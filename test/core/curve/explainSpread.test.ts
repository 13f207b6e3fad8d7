import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  buildCurve,
  buildNamedCurves,
  curveSpreadAt,
  explainCurveSpread,
  forwardOn,
  marketDate,
  parseTenor,
  readNamedCurves,
  zeroOn,
  type Compounding,
  type Curve,
  type CurveDayCount,
  type Explanation,
  type ExplainedRead,
  type SpreadMeasure,
} from '../../../src/core/index.ts';
import { expectRelClose } from '../../helpers/asserts.ts';

// The spread between two curves explained (issue 19): curveSpreadAt run with a sink per curve.
// Claims: (1) the explanation's value and last step are the spread table's figure (curveSpreadAt
// untraced) bit for bit, and each part is the untraced zeroOn / forwardOn of its own curve bit for
// bit; (2) each part's rate recomputed here from its shown inputs (its reads' ln DF, each read from
// its shown nodes where the method is local, and its year fraction) by the textbook definitions
// gives the shown rate to 1e-15 relative, and the spread is (rate of - rate over) x 10,000 of the
// shown rates exactly. Definitions (cited from memory): simple P = 1/(1 + r tau), periodic
// P = (1 + r/m)^(-m tau), continuous P = exp(-r tau) (Hull, "Options, Futures and Other
// Derivatives", chapter on interest rates); ACT/360 and ACT/365F per the 2006 ISDA Definitions
// 4.16; log-linear discount and linear zero interpolation per Hagan and West, "Interpolation
// Methods for Curve Construction" (2006). 1 bp = 0.0001 (definition). The curves are the command
// line's invented two-curve document (test/fixtures/namedCurves/SOURCE.md), built under each local
// method and under its own (monotone convex: reads not recomputed from nodes, marked non-local).

const FIXTURE = JSON.parse(readFileSync('test/fixtures/namedCurves/two-curves.json', 'utf8')) as Record<string, unknown> & { curve: Record<string, unknown>; curves: Record<string, unknown>[] };

/** The default curve and the named curves as the command line builds them, every one under `method` when given. */
function curves(method?: string): Map<string, Curve> {
  const doc = method === undefined ? FIXTURE : { ...FIXTURE, curve: { ...FIXTURE.curve, interpolation: method }, curves: FIXTURE.curves.map((c) => ({ ...c, curve: { interpolation: method } })) };
  const main = buildCurve(doc, { readCurves: readNamedCurves, skipInvalid: true });
  const out = new Map<string, Curve>([['default', main.curve!]]);
  for (const n of buildNamedCurves(main.workspace!, main.curve, { skipInvalid: true })) out.set(n.name, n.build.curve!);
  return out;
}

const PAIRS = [['euribor6m', 'default'], ['govt', 'euribor6m'], ['default', 'govt'], ['govt', 'govt']] as const;
const CONVENTIONS: [Compounding, CurveDayCount][] = [['continuous', 'ACT/365F'], ['simple', 'ACT/360'], ['semiannual', 'ACT/365F'], ['annual', 'ACT/360']];
const TENORS = ['1M', '6M', '1Y', '2Y', '5Y', '7Y', '10Y', '30Y'];

const days = (a: string, b: string): number => Math.round((Date.parse(b) - Date.parse(a)) / 86400000);

/** ln DF of a read from its shown nodes by the method's definition; null when the method reads every node. */
function lnFromNodes(r: ExplainedRead): number | null {
  const [a, b] = r.nodes;
  if (r.how === 'settlement') return 0;
  if (r.how === 'node') return a!.lnDiscount;
  if (r.how === 'extrapolated') return a!.lnDiscount - r.forward! * (r.t - a!.t);
  if (r.how !== 'interpolated') return null;
  if (r.method === 'log-linear-discount') return a!.lnDiscount + ((r.t - a!.t) / (b!.t - a!.t)) * (b!.lnDiscount - a!.lnDiscount);
  if (r.method === 'linear-zero') {
    const zb = -b!.lnDiscount / b!.t;
    if (a!.t === 0) return -zb * r.t;
    const za = -a!.lnDiscount / a!.t;
    return -(za + ((r.t - a!.t) / (b!.t - a!.t)) * (zb - za)) * r.t;
  }
  return null;
}

/** The rate of a discount factor exp(lnP) over tau years in compounding c. */
function rateOf(lnP: number, c: Compounding, tau: number): number {
  const m = { simple: 0, annual: 1, semiannual: 2, quarterly: 4, monthly: 12, continuous: Infinity }[c];
  if (m === Infinity) return -lnP / tau;
  if (m === 0) return Math.expm1(-lnP) / tau;
  return m * Math.expm1(-lnP / (m * tau));
}

let fromNodes = 0;

/** One part (`<part> ...` names in the joined explanation) recomputed from its shown inputs. */
function recomputePart(e: Explanation, part: string, curveName: string, c: Compounding, dc: CurveDayCount, src: string): number {
  const reads = e.reads.filter((r) => r.name.startsWith(`${part} DF(`));
  for (const r of reads) {
    expect(r.discount).toBe(Math.exp(r.lnDiscount));
    for (const n of r.nodes) expect(n.curve).toBe(curveName);
    const ln = lnFromNodes(r);
    if (ln !== null) fromNodes++;
    if (ln !== null) expectRelClose(Math.exp(ln), r.discount, 1e-15, `${src}: ${r.name} (${r.how}, ${r.method}) from its shown nodes`);
    else expect(r.local).toBe(false);
  }
  const tauShown = e.yearFractions.find((y) => y.name === `${part} tau`)!;
  // ACT/360 and ACT/365F: actual days over the basis (ISDA 2006 4.16).
  expect(tauShown.days).toBe(days(tauShown.from, tauShown.to));
  expectRelClose(tauShown.value, tauShown.days / (dc === 'ACT/360' ? 360 : 365), 1e-15, `${src}: ${part} tau by ${dc}`);
  const ln = (name: string): number => reads.find((r) => r.name === `${part} ${name}`)!.lnDiscount;
  const lnP = reads.length === 1 ? ln('DF(date)') : ln('DF(end)') - ln('DF(start)');
  return rateOf(lnP, c, tauShown.value);
}

describe('explainCurveSpread', () => {
  it('ends in the spread table’s figure, its parts are the untraced queries, and each part recomputes from its shown inputs', () => {
    let checked = 0;
    for (const method of [undefined, 'log-linear-discount', 'linear-zero']) {
      const built = curves(method);
      for (const [of, over] of PAIRS) {
        const a = built.get(of)!;
        const b = built.get(over)!;
        for (const [c, dc] of CONVENTIONS) {
          for (const measure of ['zero', 'forward'] as SpreadMeasure[]) {
            const tenor = parseTenor(measure === 'zero' ? '3M' : '6M')!;
            for (const t of TENORS) {
              const date = marketDate(a.settlement, parseTenor(t)!);
              const src = `${of} over ${over}, ${measure} ${t}, ${c} ${dc}, ${method ?? 'own methods'}`;
              const table = curveSpreadAt(a, b, measure, [date], c, dc, tenor)[0];
              const r = explainCurveSpread(a, b, { of, over }, measure, date, c, dc, tenor);
              if (!table) {
                expect(r.ok, src).toBe(false);
                continue;
              }
              if (!r.ok) throw new Error(r.errors[0]!.message);
              const e = r.value.explanation;
              // (1) The table's figure and the untraced queries, bit for bit.
              expect(Object.is(e.value, table.bp), src).toBe(true);
              expect(Object.is(e.steps.at(-1)!.value, table.bp), src).toBe(true);
              const untraced = (on: Curve): number => {
                const q = measure === 'zero' ? zeroOn(on, date, c, dc) : forwardOn(on, date, marketDate(date, tenor), c, dc);
                if (!q.ok) throw new Error(q.errors[0]!.message);
                return 'zero' in q.value ? q.value.zero : q.value.rate;
              };
              expect(Object.is(r.value.of.value, untraced(a)), `${src}: of`).toBe(true);
              expect(Object.is(r.value.over.value, untraced(b)), `${src}: over`).toBe(true);
              // (2) Each part from its shown inputs, then the spread from the two shown rates.
              const overPart = over === of ? `${over} (second)` : over;
              const ra = recomputePart(e, of, of, c, dc, src);
              const rb = recomputePart(e, overPart, over, c, dc, src);
              expectRelClose(ra, r.value.of.value, 1e-15, `${src}: ${of} rate by its compounding's definition`, 1e-300);
              expectRelClose(rb, r.value.over.value, 1e-15, `${src}: ${over} rate by its compounding's definition`, 1e-300);
              const rateA = e.steps.find((s) => s.name === `${of} rate`)!.value;
              const rateB = e.steps.find((s) => s.name === `${overPart} rate`)!.value;
              expect(e.steps.at(-1)!.value).toBe((rateA - rateB) * 1e4);
              expect(e.steps.at(-1)!.inputs).toEqual([`${of} rate`, `${overPart} rate`]);
              expect(e.quantity).toBe('curve-spread');
              if (of === over) expect(e.value).toBe(0);
              checked++;
            }
          }
        }
      }
    }
    expect(checked).toBeGreaterThan(400);
    expect(fromNodes).toBeGreaterThan(1000);
  });

  it('says which date no curve can read instead of explaining nothing', () => {
    const built = curves();
    const r = explainCurveSpread(built.get('govt')!, built.get('default')!, { of: 'govt', over: 'default' }, 'zero', '2020-01-01', 'continuous', 'ACT/365F', { n: 3, unit: 'M' });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0]!.message).toContain('no spread on 2020-01-01');
  });
});

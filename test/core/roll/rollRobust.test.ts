// Bad or unusual input never crashes the analysis and never yields a silent NaN: whatever the
// document's `strategy` holds, validateStrategy gives a usable strategy and path-named errors, and
// analyseRollVsTerm gives either finite figures (break-evens possibly null, never NaN) or error
// values whose paths name the strategy field at fault. A property over random raw inputs.
import fc from 'fast-check';
import { analyseRollVsTerm, validateStrategy } from '../../../src/core/index.ts';
import { rollMarketCurve } from '../../helpers/rollMarket.ts';

// The invented roll test market (test/helpers/rollMarket.ts) without its 6M and 3Y quotes.
const curve = rollMarketCurve(['1M', '3M', '1Y', '2Y', '5Y', '10Y']);

const anyText = fc.oneof(fc.constantFrom('1Y', '6M', '13M', '2027-02-30', '2026-11-30', '2026-12-02', '2036-12-01', '40Y', '', 'x'), fc.string({ maxLength: 8 }));
const rawArb = fc.record(
  {
    amount: fc.oneof(fc.constantFrom('1000000', '0.01', '1e3', '-5', '999999999999999'), fc.string({ maxLength: 6 }), fc.integer()),
    horizon: anyText,
    rollTenor: fc.constantFrom('1M', '3M', '6M', '1Y', '2W', 3),
    rollDayCount: fc.constantFrom('ACT/360', 'ACT/365F', '30/360', '30E/360', 'ACT/ACT-ISDA', 'nope'),
    bondFrequency: fc.constantFrom(1, 2, 4, 12, 3),
    ridingMaturity: anyText,
    ridingFrequency: fc.constantFrom(1, 2, 4, 12, 0),
    view: fc.constantFrom('forwards', 'unchanged', 'path', 'shift', 'scenario:gone', 'scenario-fwd:gone', 'later'),
    shiftBp: fc.oneof(fc.integer({ min: -1500, max: 1500 }), fc.constant(Number.NaN)),
    path: fc.record(
      {
        fill: fc.constantFrom('forwards', 'constant', 'ramp', 'typed', 'zigzag'),
        constant: fc.double({ min: -0.2, max: 1.2, noNaN: true }),
        rampFrom: fc.double({ min: -0.1, max: 0.2, noNaN: true }),
        rampTo: fc.double({ min: -0.1, max: 0.2, noNaN: true }),
        legs: fc.array(fc.double({ min: -0.1, max: 0.3, noNaN: true }), { maxLength: 30 }),
      },
      { requiredKeys: [] },
    ),
  },
  { requiredKeys: [] },
);

const finite = (x: number, what: string) => {
  if (!Number.isFinite(x)) throw new Error(`${what} is ${x}`);
};

describe('roll analysis on any input', () => {
  it('never throws and never gives NaN', () => {
    let analysed = 0;
    let refused = 0;
    fc.assert(
      fc.property(rawArb, (raw) => {
        const { strategy, errors } = validateStrategy(raw);
        for (const e of errors) expect(e.path.startsWith('strategy')).toBe(true);
        const r = analyseRollVsTerm(curve, strategy);
        if (!r.ok) {
          expect(r.errors.length).toBeGreaterThan(0);
          for (const e of r.errors) expect(e.path).toMatch(/^strategy\./);
          refused++;
          return;
        }
        analysed++;
        const a = r.value;
        for (const v of a.views) {
          for (const s of v.strategies) {
            finite(s.growth, `${v.id} ${s.id} growth`);
            finite(s.annualReturn, `${v.id} ${s.id} return`);
            finite(s.vsRollBp, `${v.id} ${s.id} bp`);
            expect(s.terminal.isFinite()).toBe(true);
          }
          finite(v.riding.horizonPrice, `${v.id} riding price`);
        }
        for (const x of [...Object.values(a.breakEvens.rollRate), ...Object.values(a.breakEvens.shiftBp), ...Object.values(a.breakEvens.ridingRiseBp)]) {
          if (x !== null) finite(x, 'break-even');
        }
        for (const p of a.breakEvens.curve) if (p.riseBp !== null) finite(p.riseBp, 'break-even curve');
      }),
      { numRuns: 200, seed: 4242 },
    );
    // both outcomes are exercised
    expect(analysed).toBeGreaterThan(20);
    expect(refused).toBeGreaterThan(20);
  }, 120_000); // a limit for a hung run on a loaded machine, not a speed check
});

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { builtDocumentLine, type BuiltDocument } from '../../src/cli/documentLine.ts';
import { COMPOUNDINGS, CURVE_DAY_COUNTS, EXTRAPOLATIONS, INTERPOLATIONS, QUOTE_KINDS } from '../../src/core/index.ts';

// The oracle is the platform's JSON.stringify (ECMA-262, JSON.stringify with Number::toString for
// numbers): the command's contract asks for compact JSON with numbers in full float64 precision.
// Records are random within the writer's stated precondition: strings are ISO dates or
// identifiers from the engine's lists; warnings carry free text.

const isoDate = fc
  .tuple(fc.integer({ min: 1900, max: 2199 }), fc.integer({ min: 1, max: 12 }), fc.integer({ min: 1, max: 28 }))
  .map(([y, m, d]) => `${y}-${String(m).padStart(2, '0')}-${String(d).padStart(2, '0')}`);
const finite = fc.oneof(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.constantFrom(0, -0, 5e-324, 1e21, 1e-7, 0.1 + 0.2));
const flag = fc.option(fc.constant(true as const), { nil: undefined });
const withFlag = <T extends object>(o: T, extrapolated: true | undefined): T => (extrapolated ? { ...o, extrapolated } : o);
// An `explain` object (--explain): free text and numbers, written by JSON.stringify after the flag.
const explainObject = fc.option(fc.record({ quantity: fc.string(), steps: fc.array(fc.record({ name: fc.string({ unit: 'binary' }), value: finite }), { maxLength: 3 }) }), { nil: undefined });
const withExplain = <T extends object>(o: T, explain: object | undefined): T => (explain === undefined ? o : { ...o, explain });

const record: fc.Arbitrary<BuiltDocument> = fc
  .record({
    index: fc.nat(),
    settlement: isoDate,
    valuationDate: isoDate,
    interpolation: fc.constantFrom(...INTERPOLATIONS),
    curveDayCount: fc.constantFrom(...CURVE_DAY_COUNTS),
    compounding: fc.constantFrom(...COMPOUNDINGS),
    rateDayCount: fc.constantFrom(...CURVE_DAY_COUNTS),
    extrapolation: fc.constantFrom(...EXTRAPOLATIONS),
    quotes: fc.array(
      fc
        .tuple(fc.record({ index: fc.nat(), kind: fc.constantFrom(...QUOTE_KINDS), maturity: isoDate, t: finite, unit: fc.constantFrom('price', 'rate'), repricingError: finite, start: isoDate, end: isoDate, pillar: isoDate }), fc.option(isoDate, { nil: undefined }))
        .map(([q, payment]) => ({ ...q, payment: payment ?? null })),
      { maxLength: 6 },
    ),
    points: fc.array(fc.tuple(fc.record({ date: isoDate, t: finite, discount: finite, zero: finite }), flag, explainObject).map(([p, x, e]) => withExplain(withFlag(p, x), e)), { maxLength: 6 }),
    forwards: fc.array(fc.tuple(fc.record({ start: isoDate, end: isoDate, tau: finite, rate: finite }), flag, explainObject).map(([f, x, e]) => withExplain(withFlag(f, x), e)), { maxLength: 4 }),
    bonds: fc.option(fc.array(fc.record({ maturity: isoDate, yield: finite, yieldConvention: fc.string(), keyRateDurations: fc.dictionary(fc.string(), finite) }), { maxLength: 2 }), { nil: undefined }),
    warnings: fc.array(fc.record({ path: fc.string(), quote: fc.option(fc.nat(), { nil: null }), code: fc.constant('skipped' as const), message: fc.string({ unit: 'binary' }) }), { maxLength: 3 }),
  })
  .map(({ bonds, ...rest }) => (bonds === undefined ? rest : { ...rest, bonds }) as BuiltDocument);

describe('builtDocumentLine', () => {
  it('builtDocumentLine(record) is JSON.stringify(record), field for field and digit for digit', () => {
    fc.assert(
      fc.property(record, (r) => {
        // Same key order as the contract: the record is built in that order, as the command builds it.
        const ordered = {
          index: r.index, settlement: r.settlement, valuationDate: r.valuationDate, interpolation: r.interpolation, curveDayCount: r.curveDayCount, compounding: r.compounding,
          rateDayCount: r.rateDayCount, extrapolation: r.extrapolation, quotes: r.quotes.map(({ payment, ...q }) => (payment === null ? q : { ...q, payment })), points: r.points, forwards: r.forwards,
          ...(r.bonds !== undefined ? { bonds: r.bonds } : {}), warnings: r.warnings,
        };
        expect(builtDocumentLine(r)).toBe(JSON.stringify(ordered));
      }),
      { seed: 5, numRuns: 2000 },
    );
  });
  it('builtDocumentLine writes -0 as 0 and 1e21 as 1e+21, as JSON.stringify does', () => {
    const line = builtDocumentLine({
      index: 0, settlement: '2027-03-10', valuationDate: '2027-03-10', interpolation: 'monotone-convex', curveDayCount: 'ACT/365F', compounding: 'continuous', rateDayCount: 'ACT/365F', extrapolation: 'none',
      quotes: [], points: [{ date: '2027-06-10', t: -0, discount: 1e21, zero: 1e-7 }], forwards: [], warnings: [],
    });
    expect(line).toContain('"t":0,"discount":1e+21,"zero":1e-7}');
  });
});
